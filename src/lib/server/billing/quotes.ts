import { and, desc, eq } from 'drizzle-orm';
import { CalcInputError, occupancyTimeCharges, priceCharges, type FacilityRates } from '../../calc';
import { utcDay } from '../../format';
import type { SessionUser } from '../../roles';
import type { QuoteDecision } from '../../schemas/billing';
import { actsForClient, can, canReadBilling } from '../access';
import { writeTransaction, type Db, type DbOrTx } from '../db/open';
import { campaign, campaignRevision, facility, quote } from '../db/schema';
import { refuse, type Outcome } from '../outcome';
import { actorName, recordCampaignEvent } from '../review/audit';
import { readableCampaign } from '../review/step';
import { notifyBilling } from './notices';

export type Quote = typeof quote.$inferSelect;

const DAY_MS = 24 * 3600 * 1000;

/** The facility's rates as they stand, the form a quote or invoice keeps them in. */
export function ratesOf(f: typeof facility.$inferSelect): FacilityRates {
	return {
		hourlyRate: f.hourlyRate,
		setUpFee: f.setUpFee,
		tearDownFee: f.tearDownFee,
		minimumCharge: f.minimumCharge,
		taxRate_percent: f.taxRate_percent,
		currency: f.currency
	};
}

/** The campaign's quotes, newest first. */
export function quotesOf(db: DbOrTx, campaignId: string): Quote[] {
	return db
		.select()
		.from(quote)
		.where(eq(quote.campaignId, campaignId))
		.orderBy(desc(quote.issuedAt))
		.all();
}

/** The campaign's quotes, newest first, if the viewer may see its prices; else undefined (404). */
export function campaignQuotes(db: Db, viewer: SessionUser, campaignId: string) {
	const c = readableCampaign(db, viewer, campaignId);
	if (!c || !canReadBilling(viewer, c)) return undefined;
	return { campaign: c, quotes: quotesOf(db, campaignId) };
}

export function getQuote(db: DbOrTx, viewer: SessionUser, quoteId: string): Quote | undefined {
	const q = db.select().from(quote).where(eq(quote.id, quoteId)).get();
	return q && canReadBilling(viewer, q) ? q : undefined;
}

/**
 * The client's newest accepted quote for the campaign: for one revision (what a quote-only
 * facility asks before booking), or for any (whose rates an invoice bills at).
 */
export function acceptedQuoteFor(tx: DbOrTx, campaignId: string, revisionId?: string) {
	return tx
		.select()
		.from(quote)
		.where(
			and(
				eq(quote.campaignId, campaignId),
				revisionId ? eq(quote.revisionId, revisionId) : undefined,
				eq(quote.state, 'accepted')
			)
		)
		.orderBy(desc(quote.issuedAt))
		.get();
}

/**
 * Prices the approved revision's occupancy estimate at the facility's rates of today and sends
 * it to the client team. An open quote of the campaign is superseded; once the client accepted
 * one for this revision, the next needs a new revision.
 */
export function issueQuote(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	origin: string,
	now = Date.now()
): Outcome<{ quote: Quote }> {
	if (!can(viewer, 'manage-billing'))
		return refuse('forbidden', 'Only operators and admins issue quotes.');
	return writeTransaction(db, (tx) => {
		const c = readableCampaign(tx, viewer, campaignId);
		if (!c) return refuse('not-found', 'No such campaign.');
		if (!c.approvedRevisionId)
			return refuse('conflict', 'Only a campaign with an approved revision can be quoted.');
		if (acceptedQuoteFor(tx, c.id, c.approvedRevisionId))
			return refuse(
				'conflict',
				'The client has accepted a quote for this revision; a new quote needs a new revision.'
			);
		const revision = tx
			.select()
			.from(campaignRevision)
			.where(eq(campaignRevision.id, c.approvedRevisionId))
			.get()!;
		const f = tx.select().from(facility).where(eq(facility.id, c.facilityId)).get()!;
		const rates = ratesOf(f);
		let priced;
		try {
			priced = priceCharges(occupancyTimeCharges(revision.snapshot.figures.occupancy), rates, {
				fees: true
			});
		} catch (e) {
			if (e instanceof CalcInputError)
				return refuse('conflict', `The facility's rates cannot price a quote: ${e.message}`);
			throw e;
		}
		tx.update(quote)
			.set({ state: 'superseded' })
			.where(and(eq(quote.campaignId, c.id), eq(quote.state, 'issued')))
			.run();
		const validUntil = new Date(now + f.quoteValidity_days * DAY_MS);
		const issued = tx
			.insert(quote)
			.values({
				campaignId: c.id,
				revisionId: revision.id,
				revisionNumber: revision.number,
				facilityId: f.id,
				teamId: c.teamId,
				facilityVersion: f.version,
				rates,
				occupied_s: revision.snapshot.figures.occupancy.total_s,
				lines: priced.lines,
				subtotal: priced.subtotal,
				tax: priced.tax,
				total: priced.total,
				validUntil,
				issuedBy: viewer.id,
				issuedAt: new Date(now)
			})
			.returning()
			.get();
		const summary = `${priced.total} ${rates.currency} for revision ${revision.number}, valid until ${utcDay(validUntil)}`;
		recordCampaignEvent(
			tx,
			c,
			{ id: viewer.id, name: actorName(viewer) },
			'issue-quote',
			`Quote ${summary}.`
		);
		notifyBilling(
			tx,
			c,
			{ client: true, operators: false },
			`Quote for ${c.name}: ${priced.total} ${rates.currency}`,
			`${f.name} quotes ${summary} (tax included). Accept or decline it in Tunnelwright.`,
			`${origin}/campaigns/${c.id}/quote`
		);
		return { ok: true as const, quote: issued };
	});
}

/** The client team accepts or declines an issued quote that still applies. */
export function decideQuote(
	db: Db,
	viewer: SessionUser,
	quoteId: string,
	decision: QuoteDecision,
	origin: string,
	now = Date.now()
): Outcome<{ quote: Quote }> {
	return writeTransaction(db, (tx) => {
		const q = getQuote(tx, viewer, quoteId);
		if (!q) return refuse('not-found', 'No such quote.');
		if (!actsForClient(viewer, q))
			return refuse('forbidden', 'Only the client team accepts or declines a quote.');
		if (q.state !== 'issued') return refuse('conflict', `This quote is already ${q.state}.`);
		const c = tx.select().from(campaign).where(eq(campaign.id, q.campaignId)).get()!;
		if (c.approvedRevisionId !== q.revisionId)
			return refuse(
				'conflict',
				'The campaign has another approved revision now; this quote no longer applies.'
			);
		if (decision.decision === 'accept' && now > q.validUntil.getTime())
			return refuse(
				'conflict',
				`This quote expired on ${utcDay(q.validUntil)}; ask the facility for a new one.`
			);
		const state = decision.decision === 'accept' ? 'accepted' : 'declined';
		const decided = tx
			.update(quote)
			.set({ state, decidedBy: viewer.id, decidedAt: new Date(now), decisionNote: decision.note })
			.where(eq(quote.id, q.id))
			.returning()
			.get();
		const said = `${q.total} ${q.rates.currency}, revision ${q.revisionNumber}`;
		recordCampaignEvent(
			tx,
			c,
			{ id: viewer.id, name: actorName(viewer) },
			decision.decision === 'accept' ? 'accept-quote' : 'decline-quote',
			`Quote ${state} (${said})${decision.note ? `: ${decision.note}` : '.'}`
		);
		notifyBilling(
			tx,
			c,
			{ client: false, operators: true },
			`Quote ${state}: ${c.name}`,
			`${actorName(viewer)} ${state} the quote for “${c.name}” (${said}).${decision.note ? `\n\n${decision.note}` : ''}`,
			`${origin}/campaigns/${c.id}/quote`
		);
		return { ok: true as const, quote: decided };
	});
}
