import { and, asc, desc, eq, inArray, isNull, lt, or, sql, type SQL } from 'drizzle-orm';
import { creditCharges, priceCharges, type FacilityRates } from '../../calc';
import type { SessionUser } from '../../roles';
import { can, canReadBilling } from '../access';
import { writeTransaction, type Db, type DbOrTx, type Tx } from '../db/open';
import { booking, campaign, facility, invoice, invoiceSlot } from '../db/schema';
import { refuse, type Outcome } from '../outcome';
import { actorName, recordCampaignEvent } from '../review/audit';
import { notifyBilling } from './notices';
import { documentNumber } from '../../billing/numbers';
import { acceptedQuoteFor, ratesOf } from './quotes';
import { invoiceRows, invoiceSummary, type InvoiceSummary } from './views';

/** The invoices one page of a list shows. */
export const INVOICE_PAGE_SIZE = 100;

export type Invoice = typeof invoice.$inferSelect;

/**
 * The next number of the facility's one sequence of invoices and credit notes. It is taken
 * inside the issuing write transaction, which SQLite runs one at a time (BEGIN IMMEDIATE): the
 * number and the document are written together or not at all, so no number is skipped or reused.
 * The unique index on (facility, number) stands behind it.
 */
function nextNumber(tx: Tx, facilityId: string): number {
	const row = tx
		.select({ last: sql<number>`coalesce(max(${invoice.number}), 0)` })
		.from(invoice)
		.where(eq(invoice.facilityId, facilityId))
		.get();
	return (row?.last ?? 0) + 1;
}

/** Completed slots of the campaign that no standing invoice (one not credited) bills yet. */
export function slotsToInvoice(tx: DbOrTx, campaignId: string) {
	const billed = tx
		.select({ bookingId: invoiceSlot.bookingId })
		.from(invoiceSlot)
		.innerJoin(invoice, eq(invoice.id, invoiceSlot.invoiceId))
		.where(and(eq(invoice.campaignId, campaignId), isNull(invoice.creditedBy)));
	return tx
		.select()
		.from(booking)
		.where(
			and(
				eq(booking.campaignId, campaignId),
				eq(booking.state, 'completed'),
				sql`${booking.id} NOT IN ${billed}`
			)
		)
		.orderBy(asc(booking.start))
		.all();
}

/**
 * Bills the campaign's completed slots not yet billed, at the accepted quote's rates (the
 * facility's current ones when there is no accepted quote). Set-up and tear-down fees go on
 * the campaign's first standing invoice only; the minimum charge applies to each invoice.
 */
export function issueInvoice(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	origin: string,
	now = Date.now()
): Outcome<{ invoice: Invoice }> {
	if (!can(viewer, 'manage-billing'))
		return refuse('forbidden', 'Only operators and admins issue invoices.');
	return writeTransaction(db, (tx) => {
		const c = tx.select().from(campaign).where(eq(campaign.id, campaignId)).get();
		if (!c) return refuse('not-found', 'No such campaign.', 'campaignId');
		const slots = slotsToInvoice(tx, c.id);
		if (!slots.length)
			return refuse(
				'conflict',
				'No completed slot of this campaign is waiting to be invoiced.',
				'campaignId'
			);
		const accepted = acceptedQuoteFor(tx, c.id);
		const f = tx.select().from(facility).where(eq(facility.id, c.facilityId)).get()!;
		const rates: FacilityRates = accepted?.rates ?? ratesOf(f);
		const standing = tx
			.select({ id: invoice.id })
			.from(invoice)
			.where(
				and(eq(invoice.campaignId, c.id), eq(invoice.kind, 'invoice'), isNull(invoice.creditedBy))
			)
			.get();
		const occupied_s = slots.reduce((s, b) => s + (b.end.getTime() - b.start.getTime()) / 1000, 0);
		const priced = priceCharges([{ item: 'occupied-time', time_s: occupied_s }], rates, {
			fees: !standing
		});
		const number = nextNumber(tx, f.id);
		const issued = tx
			.insert(invoice)
			.values({
				facilityId: f.id,
				number,
				kind: 'invoice',
				campaignId: c.id,
				teamId: c.teamId,
				quoteId: accepted?.id ?? null,
				rates,
				occupied_s,
				lines: priced.lines,
				subtotal: priced.subtotal,
				tax: priced.tax,
				total: priced.total,
				issuedBy: viewer.id,
				issuedAt: new Date(now)
			})
			.returning()
			.get();
		tx.insert(invoiceSlot)
			.values(
				slots.map((b) => ({ invoiceId: issued.id, bookingId: b.id, start: b.start, end: b.end }))
			)
			.run();
		const summary = `Invoice ${documentNumber(number)}: ${priced.total} ${rates.currency} for ${slots.length} completed slot(s)`;
		recordCampaignEvent(
			tx,
			c,
			{ id: viewer.id, name: actorName(viewer) },
			'issue-invoice',
			`${summary}.`
		);
		notifyBilling(
			tx,
			c,
			{ client: true, operators: false },
			`${summary} — ${c.name}`,
			`${f.name} has invoiced “${c.name}”: ${priced.total} ${rates.currency} including tax. You can pay it by card in Tunnelwright.`,
			`${origin}/invoices/${issued.id}`
		);
		return { ok: true as const, invoice: issued };
	});
}

/**
 * Cancels a whole invoice with a credit note: the next number of the same sequence, every line
 * negated. The invoice itself stays as issued; its slots can be billed again.
 */
export function creditInvoice(
	db: Db,
	viewer: SessionUser,
	invoiceId: string,
	reason: string,
	origin: string,
	now = Date.now()
): Outcome<{ invoice: Invoice }> {
	if (!can(viewer, 'manage-billing'))
		return refuse('forbidden', 'Only operators and admins issue credit notes.');
	return writeTransaction(db, (tx) => {
		const original = tx.select().from(invoice).where(eq(invoice.id, invoiceId)).get();
		if (!original) return refuse('not-found', 'No such invoice.');
		if (original.kind !== 'invoice')
			return refuse('conflict', 'A credit note is not credited again; issue a new invoice.');
		if (original.creditedBy) return refuse('conflict', 'This invoice already has a credit note.');
		const credit = creditCharges({
			...original,
			taxRate_percent: original.rates.taxRate_percent,
			currency: original.rates.currency
		});
		const c = tx.select().from(campaign).where(eq(campaign.id, original.campaignId)).get()!;
		const number = nextNumber(tx, original.facilityId);
		const issued = tx
			.insert(invoice)
			.values({
				facilityId: original.facilityId,
				number,
				kind: 'credit-note',
				campaignId: original.campaignId,
				teamId: original.teamId,
				quoteId: original.quoteId,
				creditsInvoiceId: original.id,
				rates: original.rates,
				occupied_s: -original.occupied_s,
				lines: credit.lines,
				subtotal: credit.subtotal,
				tax: credit.tax,
				total: credit.total,
				reason,
				issuedBy: viewer.id,
				issuedAt: new Date(now)
			})
			.returning()
			.get();
		tx.update(invoice).set({ creditedBy: issued.id }).where(eq(invoice.id, original.id)).run();
		const summary = `Credit note ${documentNumber(number)} cancels invoice ${documentNumber(original.number)} (${credit.total} ${original.rates.currency})`;
		recordCampaignEvent(
			tx,
			c,
			{ id: viewer.id, name: actorName(viewer) },
			'issue-credit-note',
			`${summary}: ${reason}`
		);
		notifyBilling(
			tx,
			c,
			{ client: true, operators: false },
			`${summary} — ${c.name}`,
			`${summary}.\n\nReason: ${reason}`,
			`${origin}/invoices/${issued.id}`
		);
		return { ok: true as const, invoice: issued };
	});
}

export function getInvoice(db: DbOrTx, viewer: SessionUser, id: string): Invoice | undefined {
	const found = db.select().from(invoice).where(eq(invoice.id, id)).get();
	return found && canReadBilling(viewer, found) ? found : undefined;
}

// The id breaks ties between facilities' sequences issued in the same millisecond.
const NEWEST_FIRST = [desc(invoice.issuedAt), desc(invoice.number), desc(invoice.id)];

/**
 * Every invoice and credit note of one campaign, newest first; the caller has checked that the
 * viewer may see the campaign's billing. Unpaged, since a campaign's documents are bounded by
 * its slots: each invoice bills at least one, and each credit note cancels one invoice.
 */
export function campaignInvoices(db: Db, campaignId: string): InvoiceSummary[] {
	return invoiceRows(db, eq(invoice.campaignId, campaignId))
		.orderBy(...NEWEST_FIRST)
		.all()
		.map(invoiceSummary);
}

export type InvoiceFilter = {
	facility?: string;
	team?: string;
	campaign?: string;
	/** The id of the last invoice of the page before; the page then goes on past it. */
	after?: string;
};
export type InvoicePage = { invoices: InvoiceSummary[]; next: string | null };

/**
 * A page of the invoices and credit notes the viewer may see, newest first, filtered by facility,
 * team or campaign. Pages follow on from the last row seen rather than an offset, so an invoice
 * issued while someone pages through shifts nothing they have yet to see.
 */
export function listInvoices(
	db: Db,
	viewer: SessionUser,
	filter: InvoiceFilter
): Outcome<InvoicePage> {
	const where: SQL[] = [];
	if (!can(viewer, 'manage-billing')) {
		const teams = viewer.roles.includes('aerodynamicist') ? viewer.teams.map((t) => t.id) : [];
		if (!teams.length) return { ok: true, invoices: [], next: null };
		where.push(inArray(invoice.teamId, teams));
	}
	if (filter.facility) where.push(eq(invoice.facilityId, filter.facility));
	if (filter.team) where.push(eq(invoice.teamId, filter.team));
	if (filter.campaign) where.push(eq(invoice.campaignId, filter.campaign));
	if (filter.after) {
		const last = db
			.select({ issuedAt: invoice.issuedAt, number: invoice.number })
			.from(invoice)
			.where(and(eq(invoice.id, filter.after), ...where))
			.get();
		if (!last) return refuse('invalid', 'The list cannot go on from an invoice it does not hold.');
		where.push(
			or(
				lt(invoice.issuedAt, last.issuedAt),
				and(
					eq(invoice.issuedAt, last.issuedAt),
					or(
						lt(invoice.number, last.number),
						and(eq(invoice.number, last.number), lt(invoice.id, filter.after))
					)
				)
			)!
		);
	}
	const rows = invoiceRows(db, and(...where))
		.orderBy(...NEWEST_FIRST)
		.limit(INVOICE_PAGE_SIZE + 1)
		.all();
	const page = rows.slice(0, INVOICE_PAGE_SIZE).map(invoiceSummary);
	return {
		ok: true,
		invoices: page,
		next: rows.length > INVOICE_PAGE_SIZE ? page[page.length - 1]!.id : null
	};
}
