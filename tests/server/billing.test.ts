import Decimal from 'decimal.js';
import Papa from 'papaparse';
import { eq } from 'drizzle-orm';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { bookableCampaigns, changeBooking, createBooking } from '../../src/lib/server/bookings';
import {
	campaignBilling,
	creditInvoice,
	decideQuote,
	INVOICE_PAGE_SIZE,
	issueInvoice,
	issueQuote
} from '../../src/lib/server/billing';
import {
	campaign,
	campaignRevision,
	facility,
	invoice,
	mailOutbox,
	quote
} from '../../src/lib/server/db/schema';
import { getCampaignFor } from '../../src/lib/server/campaigns';
import { auditTrail } from '../../src/lib/server/review';
import * as quoteRoute from '../../src/routes/api/v1/campaigns/[id]/quote/+server';
import * as acceptanceRoute from '../../src/routes/api/v1/quotes/[id]/acceptance/+server';
import * as invoicesRoute from '../../src/routes/api/v1/invoices/+server';
import * as invoiceRoute from '../../src/routes/api/v1/invoices/[id]/+server';
import * as invoicesCsvRoute from '../../src/routes/(app)/invoices/invoices.csv/+server';
import { approvedCampaignWorld } from './campaign-fixtures';
import { addInvoice } from './payment-fixtures';
import { callRoute as call } from './call-route';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';
// The demo facility opens Monday to Friday 07:00–19:00 Europe/Berlin; slots are in January 2027.
const NOW = DateTime.fromISO('2026-12-01T00:00', { zone: 'utc' }).toMillis();
const at = (local: string) => DateTime.fromISO(local, { zone: 'Europe/Berlin' }).toJSDate();
// Expected amounts are worked out in the tests with decimal.js, half-up to the cent.
const cents = (d: Decimal.Value) => new Decimal(d).toDecimalPlaces(2, Decimal.ROUND_HALF_UP);

const RATES = {
	hourlyRate: '780.00',
	setUpFee: '1200.00',
	tearDownFee: '600.00',
	minimumCharge: '0.00',
	taxRate_percent: '19',
	quoteValidity_days: 30
};

function billingWorld() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	db.update(facility).set(RATES).where(eq(facility.id, w.tunnel)).run();
	const completedSlot = (start: string, end: string) => {
		const made = createBooking(
			db,
			w.operator,
			w.tunnel,
			{ campaignId: w.campaignId, start: at(start), end: at(end), note: '' },
			ORIGIN,
			NOW
		);
		if (!made.ok) throw new Error(made.message);
		for (const state of ['confirmed', 'completed'] as const) {
			const moved = changeBooking(db, w.operator, made.id, { state }, 'any', ORIGIN, NOW);
			if (!moved.ok) throw new Error(moved.message);
		}
		return made.id;
	};
	const issue = () => {
		const q = issueQuote(db, w.operator, w.campaignId, ORIGIN, NOW);
		if (!q.ok) throw new Error(q.message);
		return q.quote;
	};
	return { db, ...w, completedSlot, issue };
}

const mailsTo = (db: ReturnType<typeof tempDb>, address: string) =>
	db
		.select()
		.from(mailOutbox)
		.all()
		.filter((m) => m.to.includes(address));

describe('quotes', () => {
	it('prices the approved revision’s occupancy line by line at the facility’s rates', () => {
		const { db, campaignId, issue } = billingWorld();
		const q = issue();
		const revision = db.select().from(campaignRevision).get()!;
		const { breakdown, total_s } = revision.snapshot.figures.occupancy;
		const timeLines = q.lines.filter((l) => l.time_s !== null);
		expect(timeLines.map((l) => l.time_s)).toEqual([
			breakdown.setUpAndTearDown_s,
			breakdown.modelChanges_s,
			breakdown.yawChanges_s,
			breakdown.settling_s,
			breakdown.traverseMoves_s,
			breakdown.dwell_s
		]);
		expect(timeLines.map((l) => l.amount)).toEqual(
			timeLines.map((l) => cents(new Decimal(l.time_s!).mul('780.00').div(3600)).toFixed(2))
		);
		const subtotal = timeLines.reduce((s, l) => s.plus(l.amount), new Decimal(0)).plus(1800);
		expect(q.subtotal).toBe(subtotal.toFixed(2));
		expect(q.tax).toBe(cents(subtotal.mul(19).div(100)).toFixed(2));
		expect(q.total).toBe(subtotal.plus(q.tax).toFixed(2));
		expect(q.occupied_s).toBe(total_s);
		expect(q.validUntil.getTime()).toBe(NOW + 30 * 24 * 3600 * 1000);
		expect(q.campaignId).toBe(campaignId);
	});

	it('keeps the rates it was issued with when the facility’s rates change', async () => {
		const { db, operator, campaignId, tunnel, issue } = billingWorld();
		const first = issue();
		db.update(facility)
			.set({ hourlyRate: '990.00', taxRate_percent: '7' })
			.where(eq(facility.id, tunnel))
			.run();
		const read = await call(quoteRoute.GET, db, operator, { params: { id: campaignId } });
		expect(read.status).toBe(200);
		expect(read.body).toMatchObject({ id: first.id, total: first.total, rates: RATES_SHOWN });
		const second = issue();
		expect(second.rates.hourlyRate).toBe('990.00');
		expect(second.total).not.toBe(first.total);
		const again = await call(quoteRoute.GET, db, operator, { params: { id: campaignId } });
		expect(again.body).toMatchObject({ id: second.id, state: 'issued' });
		// The older open quote is superseded; what it priced stays as it was.
		const older = await call(quoteRoute.GET, db, operator, { params: { id: campaignId } });
		expect(older.body.id).toBe(second.id);
		expect(db.select().from(quote).where(eq(quote.id, first.id)).get()).toMatchObject({
			state: 'superseded',
			total: first.total,
			rates: RATES_SHOWN
		});
	});

	it('is answered by the client team only; others are told it does not exist', async () => {
		const { db, aeroA2, aeroB, reviewer, operator, issue } = billingWorld();
		const q = issue();
		const answer = (user: typeof aeroA2, decision: 'accept' | 'decline') =>
			call(acceptanceRoute.POST, db, user, { params: { id: q.id }, body: { decision } });
		expect((await answer(aeroB, 'accept')).status).toBe(404);
		expect((await answer(reviewer, 'accept')).status).toBe(404);
		expect((await answer(operator, 'accept')).status).toBe(403);
		const accepted = await answer(aeroA2, 'accept');
		expect(accepted.status).toBe(200);
		expect(accepted.body).toMatchObject({ state: 'accepted' });
		expect((await answer(aeroA2, 'decline')).status).toBe(409);
	});

	it('cannot be accepted once it has expired', () => {
		const { db, aeroA, issue } = billingWorld();
		const q = issue();
		const late = q.validUntil.getTime() + 1;
		expect(
			decideQuote(db, aeroA, q.id, { decision: 'accept', note: '' }, ORIGIN, late)
		).toMatchObject({ ok: false, code: 'conflict' });
		expect(
			decideQuote(db, aeroA, q.id, { decision: 'decline', note: 'Too late' }, ORIGIN, late)
		).toMatchObject({ ok: true });
	});

	it('is hidden from reviewers and other teams, in the API and in the audit trail', async () => {
		const { db, aeroA, aeroB, reviewer, campaignId, issue } = billingWorld();
		issue();
		for (const viewer of [aeroB, reviewer])
			expect((await call(quoteRoute.GET, db, viewer, { params: { id: campaignId } })).status).toBe(
				404
			);
		expect((await call(quoteRoute.POST, db, aeroA, { params: { id: campaignId } })).status).toBe(
			403
		);
		const actions = (viewer: typeof aeroA) =>
			auditTrail(db, viewer, campaignId)!.map((e) => e.action);
		expect(actions(aeroA)).toContain('issue-quote');
		expect(actions(reviewer)).not.toContain('issue-quote');
	});

	it('goes to the client by e-mail and its answer to the operators', () => {
		const { db, aeroA, aeroA2, operator, issue } = billingWorld();
		const q = issue();
		expect(mailsTo(db, aeroA2.email).at(-1)!.subject).toContain(`${q.total} EUR`);
		decideQuote(db, aeroA, q.id, { decision: 'accept', note: 'Go ahead' }, ORIGIN, NOW);
		expect(mailsTo(db, operator.email).at(-1)!.subject).toMatch(/^Quote accepted/);
	});
});

const RATES_SHOWN = {
	hourlyRate: RATES.hourlyRate,
	setUpFee: RATES.setUpFee,
	taxRate_percent: RATES.taxRate_percent
};

describe('booking that needs an accepted quote', () => {
	it('is refused until the client accepts a quote for the approved revision', () => {
		const { db, operator, aeroA, tunnel, campaignId, issue } = billingWorld();
		db.update(facility).set({ quoteRequiredForBooking: true }).where(eq(facility.id, tunnel)).run();
		const book = () =>
			createBooking(
				db,
				operator,
				tunnel,
				{ campaignId, start: at('2027-01-04T08:00'), end: at('2027-01-04T10:00'), note: '' },
				ORIGIN,
				NOW
			);
		const awaiting = () =>
			bookableCampaigns(db, tunnel).find((c) => c.id === campaignId)!.awaitingQuote;
		expect(book()).toMatchObject({ ok: false, code: 'conflict', field: 'campaignId' });
		expect(awaiting()).toBe(true);
		const q = issue();
		expect(book()).toMatchObject({ ok: false, code: 'conflict' });
		decideQuote(db, aeroA, q.id, { decision: 'accept', note: '' }, ORIGIN, NOW);
		expect(awaiting()).toBe(false);
		expect(book()).toMatchObject({ ok: true });
		// Without the setting nobody waits for a quote.
		db.update(facility)
			.set({ quoteRequiredForBooking: false })
			.where(eq(facility.id, tunnel))
			.run();
		expect(bookableCampaigns(db, tunnel).every((c) => !c.awaitingQuote)).toBe(true);
	});
});

describe('invoices', () => {
	it('bill the completed slots at the accepted quote’s rates, set against the quote', async () => {
		const { db, operator, aeroA, campaignId, tunnel, completedSlot, issue } = billingWorld();
		const q = issue();
		decideQuote(db, aeroA, q.id, { decision: 'accept', note: '' }, ORIGIN, NOW);
		// The rates change after acceptance; the invoice keeps the quote's.
		db.update(facility).set({ hourlyRate: '990.00' }).where(eq(facility.id, tunnel)).run();
		completedSlot('2027-01-04T08:00', '2027-01-04T13:30');
		completedSlot('2027-01-05T09:00', '2027-01-05T13:50');
		const issued = await call(invoicesRoute.POST, db, operator, { body: { campaignId } });
		expect(issued.status).toBe(201);
		const used_s = 5.5 * 3600 + (4 * 60 + 50) * 60;
		const time = cents(new Decimal(used_s).mul('780.00').div(3600));
		const subtotal = time.plus('1200.00').plus('600.00');
		const tax = cents(subtotal.mul(19).div(100));
		expect(issued.body).toMatchObject({
			number: 1,
			printedNumber: '0001',
			kind: 'invoice',
			status: 'open',
			occupied_s: used_s,
			subtotal: subtotal.toFixed(2),
			tax: tax.toFixed(2),
			total: subtotal.plus(tax).toFixed(2),
			againstQuote: {
				quoted_s: q.occupied_s,
				used_s,
				difference_s: used_s - q.occupied_s,
				quotedTotal: q.total,
				differenceTotal: subtotal.plus(tax).minus(q.total).toFixed(2)
			}
		});
		expect(issued.body.slots).toHaveLength(2);
		expect(issued.body).not.toHaveProperty('checkoutSessionId');
		// Nothing left to bill.
		expect((await call(invoicesRoute.POST, db, operator, { body: { campaignId } })).status).toBe(
			409
		);
	});

	it('are never changed: a credit note with the next number cancels one, and its slots bill again', () => {
		const { db, operator, campaignId, completedSlot } = billingWorld();
		completedSlot('2027-01-04T08:00', '2027-01-04T12:00');
		const first = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		if (!first.ok) throw new Error(first.message);
		const before = db.select().from(invoice).where(eq(invoice.id, first.invoice.id)).get()!;
		const credit = creditInvoice(db, operator, first.invoice.id, 'Wrong slot times', ORIGIN, NOW);
		if (!credit.ok) throw new Error(credit.message);
		expect(credit.invoice).toMatchObject({
			number: 2,
			kind: 'credit-note',
			creditsInvoiceId: first.invoice.id,
			total: new Decimal(first.invoice.total).neg().toFixed(2)
		});
		const after = db.select().from(invoice).where(eq(invoice.id, first.invoice.id)).get()!;
		expect({ ...after, creditedBy: null }).toEqual(before);
		expect(after.creditedBy).toBe(credit.invoice.id);
		expect(creditInvoice(db, operator, first.invoice.id, 'Again', ORIGIN, NOW)).toMatchObject({
			code: 'conflict'
		});
		const reissued = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		expect(reissued).toMatchObject({
			ok: true,
			invoice: { number: 3, total: first.invoice.total }
		});
	});

	it('keep the campaign’s time quoted, booked, used and invoiced side by side', () => {
		const { db, operator, aeroA, campaignId, tunnel, completedSlot, issue } = billingWorld();
		const q = issue();
		decideQuote(db, aeroA, q.id, { decision: 'accept', note: '' }, ORIGIN, NOW);
		completedSlot('2027-01-04T08:00', '2027-01-04T12:00');
		const ahead = createBooking(
			db,
			operator,
			tunnel,
			{ campaignId, start: at('2027-01-06T08:00'), end: at('2027-01-06T10:30'), note: '' },
			ORIGIN,
			NOW
		);
		if (!ahead.ok) throw new Error(ahead.message);
		const time = () => campaignBilling(db, aeroA, getCampaignFor(db, aeroA, campaignId)!)!.time;
		// 4 h completed and 2.5 h pencilled; the quote's own estimate is the reference.
		expect(time()).toMatchObject({
			quoted_s: q.occupied_s,
			booked_s: 6.5 * 3600,
			used_s: 4 * 3600,
			billed_s: 0,
			toBill_s: 4 * 3600
		});
		const first = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		if (!first.ok) throw new Error(first.message);
		expect(time()).toMatchObject({ billed_s: 4 * 3600, toBill_s: 0 });
		creditInvoice(db, operator, first.invoice.id, 'Wrong slot times', ORIGIN, NOW);
		expect(time()).toMatchObject({ billed_s: 0, toBill_s: 4 * 3600 });
		expect(time().findings.map((f) => f.code)).toContain('not-yet-invoiced');
	});

	it('charge the fees once per campaign, and the minimum charge on each invoice', () => {
		const { db, operator, campaignId, tunnel, completedSlot } = billingWorld();
		db.update(facility)
			.set({ minimumCharge: '2500.00', taxRate_percent: '0' })
			.where(eq(facility.id, tunnel))
			.run();
		completedSlot('2027-01-04T08:00', '2027-01-04T09:00');
		const first = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		completedSlot('2027-01-05T08:00', '2027-01-05T09:00');
		const second = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		if (!first.ok || !second.ok) throw new Error('setup');
		// 780.00 + 1200.00 + 600.00 = 2580.00 is above the minimum; 780.00 alone is topped up.
		expect(first.invoice.subtotal).toBe('2580.00');
		expect(second.invoice.lines.map((l) => l.item)).toEqual([
			'occupied-time',
			'minimum-charge-top-up'
		]);
		expect(second.invoice.subtotal).toBe('2500.00');
	});

	it('are listed for staff and the client team; others get 404 or nothing', async () => {
		const { db, operator, aeroA2, aeroB, reviewer, campaignId, tunnel, clientA, completedSlot } =
			billingWorld();
		completedSlot('2027-01-04T08:00', '2027-01-04T12:00');
		const issued = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		if (!issued.ok) throw new Error(issued.message);
		const list = (user: typeof operator, search = '') =>
			call(invoicesRoute.GET, db, user, { search });
		expect(
			(await list(operator, `?facility=${tunnel}&team=${clientA}`)).body.invoices
		).toHaveLength(1);
		expect((await list(operator, '?team=other')).body.invoices).toHaveLength(0);
		expect((await list(aeroA2)).body.invoices).toHaveLength(1);
		expect((await list(aeroB)).body.invoices).toHaveLength(0);
		expect((await list(reviewer)).status).toBe(403);
		const read = (user: typeof operator) =>
			call(invoiceRoute.GET, db, user, { params: { id: issued.invoice.id } });
		expect((await read(aeroA2)).status).toBe(200);
		expect((await read(aeroB)).status).toBe(404);
		expect((await read(reviewer)).status).toBe(404);
		expect((await call(invoicesRoute.POST, db, aeroA2, { body: { campaignId } })).status).toBe(403);
		expect(mailsTo(db, aeroA2.email).at(-1)!.text).toContain(`/invoices/${issued.invoice.id}`);
	});

	it('page newest first from the last row seen, losing and repeating none', async () => {
		const db = tempDb();
		const w = approvedCampaignWorld(db, ORIGIN);
		// Five invoices to a millisecond, so pages also break inside a run of equal issue times.
		const count = 2 * INVOICE_PAGE_SIZE + 7;
		const issuedAt = (i: number) => new Date(Date.UTC(2027, 0, 4) + Math.floor(i / 5) * 60_000);
		const made = Array.from({ length: count }, (_, i) =>
			addInvoice(db, w, { total: '10.00', issuedAt: issuedAt(i) })
		);
		const list = async (user: typeof w.operator, search: string) =>
			(await call(invoicesRoute.GET, db, user, { search })) as {
				status: number;
				body: { invoices: { id: string; issuedAt: string }[]; next: string | null };
			};
		const seen: string[] = [];
		const sizes: number[] = [];
		let after: string | null = '';
		while (after !== null) {
			const page = await list(w.operator, after ? `?after=${after}` : '');
			expect(page.status).toBe(200);
			seen.push(...page.body.invoices.map((i) => i.id));
			sizes.push(page.body.invoices.length);
			after = page.body.next;
			// Issued while the list is paged through: it belongs on the first page, not the next.
			if (sizes.length === 1) addInvoice(db, w, { total: '10.00', issuedAt: issuedAt(count) });
		}
		expect(sizes).toEqual([INVOICE_PAGE_SIZE, INVOICE_PAGE_SIZE, 7]);
		expect(new Set(seen).size).toBe(count);
		const newestFirst = [...made].sort(
			(a, b) =>
				b.issuedAt.getTime() - a.issuedAt.getTime() || b.number - a.number || (a.id < b.id ? 1 : -1)
		);
		expect(seen).toEqual(newestFirst.map((i) => i.id));
		// The client team pages the same list; a row it may not see is no place to go on from.
		expect((await list(w.aeroA, `?after=${made[3]!.id}`)).body.invoices).toHaveLength(3);
		const elsewhere = await list(w.aeroB, `?after=${made[3]!.id}`);
		expect(elsewhere.status).toBe(400);
		expect((await list(w.operator, '?after=no-such-invoice')).status).toBe(400);
	});

	it('export the whole filtered list as CSV, oldest first, each credit note naming its invoice', async () => {
		const { db, operator, aeroA2, aeroB, reviewer, tunnel, campaignId, completedSlot } =
			billingWorld();
		completedSlot('2027-01-04T08:00', '2027-01-04T12:00');
		const first = issueInvoice(db, operator, campaignId, ORIGIN, NOW);
		if (!first.ok) throw new Error(first.message);
		const credit = creditInvoice(db, operator, first.invoice.id, 'Wrong slot', ORIGIN, NOW);
		if (!credit.ok) throw new Error(credit.message);
		// A name a spreadsheet would run as a formula goes out as text (OWASP, "CSV Injection").
		db.update(campaign).set({ name: '=1+2 wake survey' }).where(eq(campaign.id, campaignId)).run();
		const download = (user: typeof operator, search = '') =>
			call(invoicesCsvRoute.GET, db, user, { search });
		const answer = await download(operator, `?facility=${tunnel}`);
		expect(answer.headers.get('content-type')).toBe('text/csv; charset=utf-8');
		expect(answer.headers.get('content-disposition')).toMatch(
			/^attachment; filename="invoices-\d{4}-\d{2}-\d{2}\.csv"$/
		);
		// Read back with papaparse, an independent CSV reader.
		const table = Papa.parse<Record<string, string>>(answer.body as string, {
			header: true,
			skipEmptyLines: true
		});
		expect(table.errors).toEqual([]);
		expect(table.data.map((r) => [r.number, r.kind, r.total, r.corrects_number])).toEqual([
			['0001', 'invoice', first.invoice.total, ''],
			['0002', 'credit-note', credit.invoice.total, '0001']
		]);
		// 08:00 to 12:00 is 4 h.
		expect(table.data[0]).toMatchObject({
			occupied_h: '4.00',
			currency: 'EUR',
			status: 'credited',
			campaign: "'=1+2 wake survey"
		});
		const rowsOf = async (user: typeof operator) =>
			((await download(user)).body as string).trim().split('\n').length - 1;
		expect(await rowsOf(aeroA2)).toBe(2);
		expect(await rowsOf(aeroB)).toBe(0);
		expect((await download(reviewer)).status).toBe(403);
	});
});
