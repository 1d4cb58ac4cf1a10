import { eq } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import { actsForClient, can, canReadBilling, type CampaignAccessFacts } from '../access';
import type { Db } from '../db/open';
import { timeLedger } from '../../billing/time-ledger';
import { booking, campaignRevision } from '../db/schema';
import { acceptedQuoteFor, quotesOf } from './quotes';
import { campaignInvoices, slotsToInvoice } from './invoices';

/**
 * A campaign's money in one view for its quote page: the quotes newest first, its invoices and
 * credit notes, its time quoted, booked, used and billed, the completed slots waiting for an
 * invoice, and what the viewer may do next.
 * `c` is a campaign the viewer may read; undefined when they may not see its prices (404).
 */
export function campaignBilling(
	db: Db,
	viewer: SessionUser,
	c: CampaignAccessFacts & { id: string; approvedRevisionId: string | null },
	now = Date.now()
) {
	if (!canReadBilling(viewer, c)) return undefined;
	const quotes = quotesOf(db, c.id);
	const approvedRevision = c.approvedRevisionId
		? db
				.select({ number: campaignRevision.number })
				.from(campaignRevision)
				.where(eq(campaignRevision.id, c.approvedRevisionId))
				.get()?.number
		: undefined;
	const current = quotes[0];
	const invoices = campaignInvoices(db, c.id);
	const slots = db
		.select({ state: booking.state, start: booking.start, end: booking.end })
		.from(booking)
		.where(eq(booking.campaignId, c.id))
		.all();
	// The quote the invoices are set against: the newest the client accepted.
	const accepted = quotes.find((q) => q.state === 'accepted');
	const staff = can(viewer, 'manage-billing');
	const answerable =
		!!current &&
		current.state === 'issued' &&
		current.revisionId === c.approvedRevisionId &&
		now <= current.validUntil.getTime();
	return {
		approvedRevision: approvedRevision ?? null,
		quotes,
		invoices,
		time: timeLedger(accepted?.occupied_s ?? null, slots, invoices),
		waitingSlots: slotsToInvoice(db, c.id).length,
		canIssueQuote:
			staff && !!c.approvedRevisionId && !acceptedQuoteFor(db, c.id, c.approvedRevisionId),
		canAnswerQuote: answerable && actsForClient(viewer, c),
		canIssueInvoice: staff
	};
}
