import Database from 'better-sqlite3';
import { randomBytes, randomUUID } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_READINGS } from '../../scripts/demo-scenario';
import { documentNumber } from '../../src/lib/billing/numbers';
import { toMinorUnits } from '../../src/lib/calc';
import { launchBrowser, signedInPage, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const OWNER = 'aero2@demo.test';
const TOTAL = '1234.50';

function openDb() {
	return new Database(inject('databasePath'), { fileMustExist: true });
}

/**
 * An invoice of the demo's approved campaign with a stand-in checkout session for it, written
 * into the database: the demo issues no invoice, and the invoice page that opens a session is
 * not what this test is about. The session is what `startCheckout` would have made.
 */
function invoiceWithCheckout(number: number) {
	const db = openDb();
	try {
		const campaign = db
			.prepare(
				`select c.id, c.team_id as teamId, c.facility_id as facilityId from campaign c
					where c.name = ?`
			)
			.get(DEMO_READINGS.campaign) as { id: string; teamId: string; facilityId: string };
		const invoiceId = randomUUID();
		const rates = {
			hourlyRate: '780.00',
			setUpFee: '0.00',
			tearDownFee: '0.00',
			minimumCharge: '0.00',
			taxRate_percent: '0',
			currency: 'EUR'
		};
		db.prepare(
			`insert into invoice (id, facility_id, number, kind, campaign_id, team_id, rates,
				occupied_s, lines, subtotal, tax, total) values (?, ?, ?, 'invoice', ?, ?, ?, 5697, '[]', ?, '0.00', ?)`
		).run(
			invoiceId,
			campaign.facilityId,
			number,
			campaign.id,
			campaign.teamId,
			JSON.stringify(rates),
			TOTAL,
			TOTAL
		);
		const sessionId = `cs_test_${randomBytes(24).toString('hex')}`;
		const back = url(`/campaigns/${campaign.id}`);
		db.prepare(
			`insert into fake_checkout_session
				(id, amount_minor, currency, description, metadata, success_url, cancel_url)
				values (?, ?, 'eur', ?, ?, ?, ?)`
		).run(
			sessionId,
			toMinorUnits(TOTAL, 'EUR'),
			`Invoice ${number}`,
			JSON.stringify({ invoiceId }),
			`${back}?paid=1`,
			back
		);
		db.prepare(`update invoice set checkout_session_id = ? where id = ?`).run(sessionId, invoiceId);
		return { invoiceId, sessionId, back };
	} finally {
		db.close();
	}
}

function paymentRecords(invoiceId: string) {
	const db = openDb();
	try {
		const paid = db
			.prepare(
				`select number, paid_at as paidAt, payment_event_id as eventId, campaign_id as campaignId
					from invoice where id = ?`
			)
			.get(invoiceId) as {
			number: number;
			paidAt: number | null;
			eventId: string | null;
			campaignId: string;
		};
		const count = (sql: string, ...args: unknown[]) =>
			(db.prepare(sql).get(...args) as { n: number }).n;
		return {
			...paid,
			audits: count(
				`select count(*) as n from audit_event
					where campaign_id = ? and action = 'receive-payment' and notes like ?`,
				paid.campaignId,
				`Invoice ${documentNumber(paid.number)}:%`
			),
			mails: count(
				`select count(*) as n from mail_outbox where kind = 'billing' and subject like ?`,
				`Invoice ${documentNumber(paid.number)}: % paid — %`
			)
		};
	} finally {
		db.close();
	}
}

describe('paying an invoice on the local stand-in', () => {
	it('shows a test page without card fields, and Pay, by keyboard, marks the invoice paid through the webhook', async () => {
		const { invoiceId, sessionId, back } = invoiceWithCheckout(90_001);
		const page = await signedInPage(browser, OWNER);
		await page.goto(url(`/payments/test-checkout/${sessionId}`));
		await expect
			.poll(() => page.getByRole('note').filter({ hasText: 'stand-in' }).innerText())
			.toMatch(/no card is asked for and no money moves/);
		expect(await page.locator('input:not([type="hidden"]), select, textarea').count()).toBe(0);
		expect(await page.getByText('Invoice 90001').count()).toBe(1);
		const pay = page.getByRole('button', { name: 'Pay 1234.50 EUR' });
		await pay.focus();
		await Promise.all([page.waitForURL(`${back}?paid=1`), page.keyboard.press('Enter')]);

		const records = paymentRecords(invoiceId);
		expect(records.paidAt).not.toBeNull();
		expect(records.eventId).toMatch(/^evt_test_/);
		expect(records.audits).toBe(1);
		expect(records.mails).toBe(1);

		await page.goto(url(`/payments/test-checkout/${sessionId}`));
		expect(await page.getByRole('button', { name: /^Pay/ }).count()).toBe(0);
		expect(await page.getByRole('status').textContent()).toMatch(/ended/);
	});

	it('Cancel goes back and leaves the invoice unpaid', async () => {
		const { invoiceId, sessionId, back } = invoiceWithCheckout(90_002);
		const page = await signedInPage(browser, OWNER);
		await page.goto(url(`/payments/test-checkout/${sessionId}`));
		await Promise.all([
			page.waitForURL(back),
			page.getByRole('button', { name: 'Cancel' }).click()
		]);
		expect(paymentRecords(invoiceId).paidAt).toBeNull();
	});

	it('answers an unsigned webhook call 400 with the structured error', async () => {
		const answer = await fetch(url('/api/v1/payments/webhook'), {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ id: 'evt_forged', type: 'checkout.session.completed' })
		});
		expect(answer.status).toBe(400);
		expect((await answer.json()).error.code).toBe('bad-signature');
	});
});
