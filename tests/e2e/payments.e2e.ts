import Database from 'better-sqlite3';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_BILLING, DEMO_BOOKING } from '../../scripts/demo-scenario';
import { documentNumber } from '../../src/lib/billing/numbers';
import { launchBrowser, signedInPage, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const OWNER = 'aero2@demo.test';

/** The demo's open invoice: the approved campaign's first slots, issued by the seed. */
function demoInvoice() {
	const db = new Database(inject('databasePath'), { readonly: true, fileMustExist: true });
	try {
		return db
			.prepare(
				`select i.id, i.number, i.total from invoice i join campaign c on c.id = i.campaign_id
					where c.name = ? and i.kind = 'invoice' order by i.number limit 1`
			)
			.get(DEMO_BILLING.campaign) as { id: string; number: number; total: string };
	} finally {
		db.close();
	}
}

function paymentRecords(invoiceId: string) {
	const db = new Database(inject('databasePath'), { readonly: true, fileMustExist: true });
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
				// Numbers run per facility, so the campaign's name tells this invoice's notice apart.
				`Invoice ${documentNumber(paid.number)}: % paid — ${DEMO_BILLING.campaign}`
			)
		};
	} finally {
		db.close();
	}
}

/** The client on the invoice page, sent to the stand-in's checkout page by its Pay button. */
async function toCheckout(page: Page, invoice: { id: string; total: string }) {
	await page.goto(url(`/invoices/${invoice.id}`));
	await Promise.all([
		page.waitForURL((u) => u.pathname.startsWith('/payments/test-checkout/')),
		page.getByRole('button', { name: /^Pay / }).click()
	]);
	return page.url();
}

describe('paying an invoice on the local stand-in', () => {
	it('Cancel goes back to the invoice and leaves it unpaid', async () => {
		const invoice = demoInvoice();
		const page = await signedInPage(browser, OWNER);
		await toCheckout(page, invoice);
		await Promise.all([
			page.waitForURL(url(`/invoices/${invoice.id}?payment=cancelled`)),
			page.getByRole('button', { name: 'Cancel' }).click()
		]);
		await page.getByRole('status').filter({ hasText: 'nothing was charged' }).waitFor();
		expect(paymentRecords(invoice.id).paidAt).toBeNull();
	});

	it('shows a test page without card fields, and Pay, by keyboard, marks the invoice paid through the webhook', async () => {
		const invoice = demoInvoice();
		const page = await signedInPage(browser, OWNER);
		const checkout = await toCheckout(page, invoice);
		await expect
			.poll(() => page.getByRole('note').filter({ hasText: 'stand-in' }).innerText())
			.toMatch(/no card is asked for and no money moves/);
		expect(await page.locator('input:not([type="hidden"]), select, textarea').count()).toBe(0);
		const description = `${DEMO_BOOKING.facility}, invoice ${documentNumber(invoice.number)}`;
		expect(await page.getByText(description, { exact: true }).count()).toBe(1);
		const pay = page.getByRole('button', { name: /^Pay / });
		await pay.focus();
		await Promise.all([
			page.waitForURL(url(`/invoices/${invoice.id}?payment=done`)),
			page.keyboard.press('Enter')
		]);
		await page.getByTestId('invoice-status').getByText('paid').waitFor({ timeout: 30_000 });

		const records = paymentRecords(invoice.id);
		expect(records.paidAt).not.toBeNull();
		expect(records.eventId).toMatch(/^evt_test_/);
		expect(records.audits).toBe(1);
		expect(records.mails).toBe(1);

		await page.goto(checkout);
		expect(await page.getByRole('button', { name: /^Pay/ }).count()).toBe(0);
		expect(await page.getByRole('status').textContent()).toMatch(/ended/);
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
