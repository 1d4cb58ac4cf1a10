import { and, asc, eq, gt, inArray, lt, sql } from 'drizzle-orm';
import { proposeSlots } from '../../booking/calendar';
import type { Interval } from '../../booking/rules';
import type { Db } from '../db/open';
import { booking, campaign, campaignRevision, quote } from '../db/schema';
import { getFacility } from '../facilities';
import { refuse, type Outcome } from '../outcome';
import { listClosures } from './closures';
import { activeBooking } from './conflicts';

/**
 * Campaigns with an approved revision for this facility, how long each needs and has booked,
 * and whether it still waits for the client to accept a quote where the facility asks for one.
 */
export function bookableCampaigns(db: Db, facilityId: string) {
	const quoteRequired = getFacility(db, facilityId)?.quoteRequiredForBooking ?? false;
	const held = db
		.select({
			campaignId: booking.campaignId,
			booked_ms: sql<number>`sum(${booking.end} - ${booking.start})`.as('booked_ms')
		})
		.from(booking)
		.where(
			and(
				eq(booking.facilityId, facilityId),
				inArray(booking.state, ['pencilled', 'confirmed', 'completed'])
			)
		)
		.groupBy(booking.campaignId)
		.as('held');
	return db
		.select({
			id: campaign.id,
			name: campaign.name,
			state: campaign.state,
			snapshot: campaignRevision.snapshot,
			booked_ms: held.booked_ms,
			quoteAccepted: sql<number>`exists (select 1 from ${quote} where ${quote.campaignId} = ${campaign.id}
				and ${quote.revisionId} = ${campaign.approvedRevisionId} and ${quote.state} = 'accepted')`
		})
		.from(campaign)
		.innerJoin(campaignRevision, eq(campaignRevision.id, campaign.approvedRevisionId))
		.leftJoin(held, eq(held.campaignId, campaign.id))
		.where(eq(campaign.facilityId, facilityId))
		.orderBy(asc(campaign.name))
		.all()
		.map(({ snapshot, booked_ms, quoteAccepted, ...c }) => ({
			...c,
			occupancy_s: snapshot.figures.occupancy.total_s,
			booked_s: (booked_ms ?? 0) / 1000,
			awaitingQuote: quoteRequired && !quoteAccepted
		}));
}

/**
 * The first free slots that hold what the campaign still needs, from `from` on, cut by the
 * facility's minimum slot and step; refused with the reason when the time does not fit.
 */
export function proposeFor(
	db: Db,
	facilityId: string,
	needed_s: number,
	from: number
): Outcome<{ slots: Interval[] }> {
	const f = getFacility(db, facilityId);
	if (!f) return refuse('not-found', 'No such facility.');
	if (needed_s <= 0) return { ok: true, slots: [] };
	const horizon_days = 120;
	const horizon = new Date(from + horizon_days * 86_400_000);
	const busy = [
		...db
			.select({ start: booking.start, end: booking.end })
			.from(booking)
			.where(
				and(
					eq(booking.facilityId, facilityId),
					activeBooking,
					gt(booking.end, new Date(from)),
					lt(booking.start, horizon)
				)
			)
			.all(),
		...listClosures(db, facilityId, new Date(from), horizon)
	].map((x) => ({ start: x.start.getTime(), end: x.end.getTime() }));
	const proposal = proposeSlots(needed_s, {
		hours: f.openingHours,
		timeZone: f.timeZone,
		busy,
		from_ms: from,
		horizon_days,
		minimumSlot_s: f.minimumSlot_s,
		slotStep_s: f.slotStep_s
	});
	return proposal.ok ? proposal : refuse('conflict', proposal.message);
}
