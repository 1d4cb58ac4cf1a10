/**
 * Money for tunnel time, end to end in the browser on the local payment stand-in: the operator
 * quotes an approved campaign, the client accepts, the slots are booked and run, the operator
 * invoices the time used, the client pays on the hosted checkout page, and the invoice shows
 * paid only once the signed webhook has arrived, with every notice in the mail catcher.
 */
import Database from 'better-sqlite3';
import { DateTime } from 'luxon';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchBrowser, ownOrigin, signedInPage, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const CAMPAIGN = 'Splitter height sweep, billed';

function caughtMail(): { subject: string; to: string[] }[] {
	const db = new Database(inject('databasePath'), { readonly: true });
	try {
		const rows = db.prepare('select subject, "to" from caught_mail order by created_at').all() as {
			subject: string;
			to: string;
		}[];
		return rows.map((r) => ({ subject: r.subject, to: JSON.parse(r.to) as string[] }));
	} finally {
		db.close();
	}
}

async function api<T>(page: Page, method: string, path: string, body?: unknown, headers = {}) {
	const answer = await page.request.fetch(url(path), {
		method,
		headers: { ...ownOrigin(), ...headers },
		data: body === undefined ? undefined : JSON.stringify(body)
	});
	if (answer.status() >= 400)
		throw new Error(`${method} ${path}: ${answer.status()} ${await answer.text()}`);
	return (await answer.json()) as T;
}

/** A new campaign of the client's, copied from one of theirs, submitted and approved. */
async function approvedCampaign(client: Page, reviewer: Page) {
	const { campaigns } = await api<{ campaigns: { id: string; state: string }[] }>(
		client,
		'GET',
		'/api/v1/campaigns'
	);
	// Any of the client's campaigns lends its definition; other tests move their states about.
	const [source] = campaigns;
	if (!source) throw new Error('The client has no campaign to copy.');
	const body = await api<Record<string, unknown>>(client, 'GET', `/api/v1/campaigns/${source.id}`);
	const made = await api<{ id: string }>(client, 'POST', '/api/v1/campaigns', {
		...body,
		name: CAMPAIGN
	});
	await api(client, 'POST', `/api/v1/campaigns/${made.id}/submit`);
	await api(reviewer, 'POST', `/api/v1/campaigns/${made.id}/decisions`, {
		revision: 1,
		verdict: 'approve',
		summary: 'Fine to run.',
		notes: []
	});
	return { id: made.id, facilityId: body.facilityId as string };
}

/** Books one slot far ahead in the facility's opening hours, then confirms and completes it. */
async function runSlot(operator: Page, facilityId: string, campaignId: string, hours: number) {
	const { facility } = await api<{
		facility: { timeZone: string; openingHours: Record<string, [string, string]> };
	}>(operator, 'GET', `/api/v1/facilities/${facilityId}`);
	const days = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'];
	let day = DateTime.now().setZone(facility.timeZone).plus({ days: 700 }).startOf('day');
	while (!facility.openingHours[days[day.weekday - 1]!]) day = day.plus({ days: 1 });
	const [opens] = facility.openingHours[days[day.weekday - 1]!]!;
	const [h, m] = opens.split(':').map(Number);
	const start = day.set({ hour: h!, minute: m! });
	const made = await api<{ id: string }>(
		operator,
		'POST',
		`/api/v1/facilities/${facilityId}/bookings`,
		{
			campaignId,
			start: start.toUTC().toISO(),
			end: start.plus({ hours }).toUTC().toISO(),
			note: ''
		}
	);
	for (const state of ['confirmed', 'completed'])
		await api(operator, 'PATCH', `/api/v1/bookings/${made.id}`, { state }, { 'if-match': '*' });
}

describe('quote, acceptance, booking, invoice and payment', () => {
	it('runs from the operator’s quote to an invoice paid through the hosted checkout', async () => {
		const client = await signedInPage(browser, 'aero@demo.test');
		const operator = await signedInPage(browser, 'operator@demo.test');
		const reviewer = await signedInPage(browser, 'reviewer@demo.test');
		const campaign = await approvedCampaign(client, reviewer);

		// The operator quotes the approved revision.
		await operator.goto(url(`/campaigns/${campaign.id}`));
		await operator.getByRole('link', { name: 'Quote and invoices' }).click();
		await operator.getByRole('button', { name: 'Issue quote' }).click();
		await operator.getByTestId('quote-state').getByText('issued').waitFor();
		const quoted = (await operator.getByTestId('document-total').textContent())!.trim();

		// The reviewer sees the campaign, not its price.
		const hidden = await reviewer.goto(url(`/campaigns/${campaign.id}/quote`));
		expect(hidden?.status()).toBe(404);

		// The client accepts it.
		await client.goto(url(`/campaigns/${campaign.id}/quote`));
		expect((await client.getByTestId('document-total').textContent())!.trim()).toBe(quoted);
		await client.getByLabel('Note to the facility (optional)').fill('Go ahead with the sweep.');
		await client.getByRole('button', { name: 'Accept quote' }).click();
		await client.getByTestId('quote-state').getByText('accepted').waitFor();

		// A slot is booked and run.
		await runSlot(operator, campaign.facilityId, campaign.id, 3);

		// The operator sees the 3 h used and not yet invoiced, then invoices it against the quote.
		await operator.reload();
		const ledger = operator.getByRole('region', { name: 'Tunnel time' });
		expect(await ledger.getByRole('row', { name: /^Used/ }).textContent()).toContain('3.00 h');
		expect(await ledger.getByRole('row', { name: /^Invoiced/ }).textContent()).toContain('0.00 h');
		await ledger.getByText('3.00 h of completed slots not yet invoiced.').waitFor();
		await operator.getByRole('button', { name: 'Invoice completed slots' }).click();
		await operator.waitForURL(/\/invoices\/[\w-]+$/);
		const invoiceUrl = operator.url();
		await operator.getByTestId('invoice-status').getByText('open').waitFor();
		await operator.getByRole('heading', { name: /Against the accepted quote/ }).waitFor();

		// The client pays on the hosted checkout page and comes back to a paid invoice.
		await client.goto(invoiceUrl);
		const total = (await client.getByTestId('document-total').textContent())!.trim();
		await client.getByRole('button', { name: `Pay ${total}` }).click();
		await client.waitForURL((u) => !u.pathname.startsWith('/invoices/'));
		await client.getByRole('button', { name: /^Pay/ }).click();
		await client.waitForURL((u) => u.href.startsWith(invoiceUrl));
		await client.getByTestId('invoice-status').getByText('paid').waitFor({ timeout: 30_000 });

		const expected = [
			{ subject: `Quote for ${CAMPAIGN}`, to: 'aero@demo.test' },
			{ subject: `Quote accepted: ${CAMPAIGN}`, to: 'operator@demo.test' },
			{ subject: `— ${CAMPAIGN}`, to: 'aero@demo.test' },
			{ subject: 'paid', to: 'aero@demo.test' }
		];
		await expect
			.poll(
				() => {
					const mine = caughtMail().filter(
						(m) => m.subject.includes(CAMPAIGN) || m.subject.includes('paid')
					);
					return expected.every((e) =>
						mine.some((m) => m.subject.includes(e.subject) && m.to.includes(e.to))
					);
				},
				{ timeout: 20_000 }
			)
			.toBe(true);
	});
});
