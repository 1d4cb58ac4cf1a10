import { eq } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import { actsForClient, can } from '../access';
import type { Db } from '../db/open';
import { campaignRevision } from '../db/schema';
import { acceptedQuoteFor, campaignQuotes } from './quotes';
import { listInvoices, slotsToInvoice } from './invoices';
import { invoiceView } from './views';

/**
 * A campaign's money in one view for its quote page: the quotes newest first, its invoices and
 * credit notes, the completed slots waiting for an invoice, and what the viewer may do next.
 * Undefined when the viewer may not see the campaign's prices (404).
 */
export function campaignBilling(db: Db, viewer: SessionUser, campaignId: string, now = Date.now()) {
	const found = campaignQuotes(db, viewer, campaignId);
	if (!found) return undefined;
	const { campaign: c, quotes } = found;
	const approvedRevision = c.approvedRevisionId
		? db
				.select({ number: campaignRevision.number })
				.from(campaignRevision)
				.where(eq(campaignRevision.id, c.approvedRevisionId))
				.get()?.number
		: undefined;
	const current = quotes[0];
	const staff = can(viewer, 'manage-billing');
	const answerable =
		!!current &&
		current.state === 'issued' &&
		current.revisionId === c.approvedRevisionId &&
		now <= current.validUntil.getTime();
	return {
		approvedRevision: approvedRevision ?? null,
		quotes,
		invoices: listInvoices(db, viewer, { campaign: c.id }).map((row) =>
			invoiceView(db, row.invoice)
		),
		waitingSlots: slotsToInvoice(db, c.id).length,
		canIssueQuote:
			staff && !!c.approvedRevisionId && !acceptedQuoteFor(db, c.id, c.approvedRevisionId),
		canAnswerQuote: answerable && actsForClient(viewer, c),
		canIssueInvoice: staff
	};
}
