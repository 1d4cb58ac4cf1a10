import { asc, eq, type SQL } from 'drizzle-orm';
import { amountDifference } from '../../calc';
import { documentNumber } from '../../billing/numbers';
import type { DbOrTx } from '../db/open';
import { campaign, facility, invoice, invoiceSlot, quote, team } from '../db/schema';
import type { Invoice } from './invoices';
import type { Quote } from './quotes';

/** What the API tells of a quote; the same fields the quote page prints. */
export function quoteResource(q: Quote) {
	return {
		id: q.id,
		campaignId: q.campaignId,
		revision: q.revisionNumber,
		facilityId: q.facilityId,
		teamId: q.teamId,
		state: q.state,
		rates: q.rates,
		facilityVersion: q.facilityVersion,
		occupied_s: q.occupied_s,
		lines: q.lines,
		subtotal: q.subtotal,
		tax: q.tax,
		total: q.total,
		currency: q.rates.currency,
		issuedAt: q.issuedAt,
		validUntil: q.validUntil,
		decidedAt: q.decidedAt,
		decisionNote: q.decisionNote
	};
}

/** The invoice and the names printed on it, from one query, for a list or one document. */
export function invoiceRows(db: DbOrTx, where: SQL | undefined) {
	return db
		.select({
			invoice,
			facilityName: facility.name,
			teamName: team.name,
			campaignName: campaign.name
		})
		.from(invoice)
		.innerJoin(facility, eq(facility.id, invoice.facilityId))
		.innerJoin(team, eq(team.id, invoice.teamId))
		.innerJoin(campaign, eq(campaign.id, invoice.campaignId))
		.where(where);
}
type InvoiceRow = {
	invoice: Invoice;
	facilityName: string;
	teamName: string;
	campaignName: string;
};

function invoiceStatus(inv: Invoice) {
	if (inv.kind === 'credit-note') return 'credit-note' as const;
	if (inv.paidAt) return 'paid' as const;
	return inv.creditedBy ? ('credited' as const) : ('open' as const);
}

/**
 * An invoice or credit note as lists, pages and the API show it: without the payment
 * service's ids or who issued it, with its printed number, names and status.
 */
export function invoiceSummary({ invoice: inv, ...names }: InvoiceRow) {
	const { checkoutSessionId: _session, paymentEventId: _event, issuedBy: _by, ...shown } = inv;
	return {
		...shown,
		...names,
		currency: inv.rates.currency,
		printedNumber: documentNumber(inv.number),
		status: invoiceStatus(inv)
	};
}
export type InvoiceSummary = ReturnType<typeof invoiceSummary>;

/**
 * One invoice or credit note with what its page and API show beside the summary: the slots it
 * bills, the document it corrects or that corrects it, and how it compares with the accepted
 * quote (time and total quoted, used, and the difference).
 */
export function invoiceView(db: DbOrTx, inv: Invoice) {
	const summary = invoiceSummary(invoiceRows(db, eq(invoice.id, inv.id)).get()!);
	const slots = db
		.select({ bookingId: invoiceSlot.bookingId, start: invoiceSlot.start, end: invoiceSlot.end })
		.from(invoiceSlot)
		.where(
			eq(invoiceSlot.invoiceId, inv.kind === 'invoice' ? inv.id : (inv.creditsInvoiceId ?? ''))
		)
		.orderBy(asc(invoiceSlot.start))
		.all();
	const related = (id: string | null) => {
		const found = id
			? db.select({ number: invoice.number }).from(invoice).where(eq(invoice.id, id)).get()
			: undefined;
		return found ? { id: id!, number: documentNumber(found.number) } : null;
	};
	const q = inv.quoteId
		? db.select().from(quote).where(eq(quote.id, inv.quoteId)).get()
		: undefined;
	const againstQuote =
		q && inv.kind === 'invoice'
			? {
					quoteId: q.id,
					revision: q.revisionNumber,
					quoted_s: q.occupied_s,
					used_s: inv.occupied_s,
					difference_s: inv.occupied_s - q.occupied_s,
					quotedTotal: q.total,
					invoicedTotal: inv.total,
					differenceTotal: amountDifference(inv.total, q.total, summary.currency)
				}
			: null;
	return {
		...summary,
		slots,
		againstQuote,
		credits: related(inv.creditsInvoiceId),
		creditedBy: related(inv.creditedBy)
	};
}
export type InvoiceView = ReturnType<typeof invoiceView>;
