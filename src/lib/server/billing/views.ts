import { asc, eq } from 'drizzle-orm';
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

/**
 * An invoice or credit note with what its page and API show beside it: the names on it, the
 * slots it bills, the document it corrects or that corrects it, and how it compares with the
 * accepted quote (time and total quoted, used, and the difference).
 */
export function invoiceView(db: DbOrTx, inv: Invoice) {
	const names = db
		.select({
			facility: facility.name,
			team: team.name,
			campaign: campaign.name,
			ownerId: campaign.ownerId
		})
		.from(campaign)
		.innerJoin(facility, eq(facility.id, inv.facilityId))
		.innerJoin(team, eq(team.id, inv.teamId))
		.where(eq(campaign.id, inv.campaignId))
		.get()!;
	const slots = db
		.select({ bookingId: invoiceSlot.bookingId, start: invoiceSlot.start, end: invoiceSlot.end })
		.from(invoiceSlot)
		.where(
			eq(invoiceSlot.invoiceId, inv.kind === 'invoice' ? inv.id : (inv.creditsInvoiceId ?? ''))
		)
		.orderBy(asc(invoiceSlot.start))
		.all();
	const numberOf = (id: string | null) =>
		id
			? db.select({ number: invoice.number }).from(invoice).where(eq(invoice.id, id)).get()?.number
			: undefined;
	const q = inv.quoteId
		? db.select().from(quote).where(eq(quote.id, inv.quoteId)).get()
		: undefined;
	const currency = inv.rates.currency;
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
					differenceTotal: amountDifference(inv.total, q.total, currency)
				}
			: null;
	const credits = numberOf(inv.creditsInvoiceId);
	const creditedBy = numberOf(inv.creditedBy);
	return {
		...inv,
		currency,
		printedNumber: documentNumber(inv.number),
		facilityName: names.facility,
		teamName: names.team,
		campaignName: names.campaign,
		slots,
		againstQuote,
		credits:
			credits === undefined ? null : { id: inv.creditsInvoiceId!, number: documentNumber(credits) },
		creditedBy:
			creditedBy === undefined ? null : { id: inv.creditedBy!, number: documentNumber(creditedBy) },
		status:
			inv.kind === 'credit-note'
				? 'credit-note'
				: inv.paidAt
					? 'paid'
					: inv.creditedBy
						? 'credited'
						: 'open'
	} as const;
}
export type InvoiceView = ReturnType<typeof invoiceView>;

/** What the API tells of an invoice: its view without internal ids of the payment service. */
export function invoiceResource(view: InvoiceView) {
	const { checkoutSessionId: _session, paymentEventId: _event, issuedBy: _by, ...shown } = view;
	return shown;
}
