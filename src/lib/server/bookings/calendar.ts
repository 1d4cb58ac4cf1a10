import { and, asc, eq, gt, lt } from 'drizzle-orm';
import { occupancyCost } from '../../calc';
import type { SessionUser } from '../../roles';
import { canSeeBookingDetails } from '../access';
import type { Db } from '../db/open';
import { booking, campaign } from '../db/schema';
import { getFacility } from '../facilities';
import type { Booking } from './slots';

export type CalendarEntry = Booking & {
	campaignName: string | null;
	cost: string | null;
	currency: string;
	teamId: string;
	stale: boolean;
};

/**
 * Bookings of a facility meeting [from, to). Staff see every detail; an aerodynamicist sees
 * their own team's slots and other slots only as busy time, since clients' work is confidential.
 */
export function listBookings(
	db: Db,
	viewer: SessionUser,
	facilityId: string,
	from: Date,
	to: Date
): CalendarEntry[] {
	const f = getFacility(db, facilityId);
	if (!f) return [];
	const rows = db
		.select({
			b: booking,
			campaignName: campaign.name,
			teamId: campaign.teamId,
			approvedRevisionId: campaign.approvedRevisionId,
			campaignState: campaign.state
		})
		.from(booking)
		.innerJoin(campaign, eq(campaign.id, booking.campaignId))
		.where(and(eq(booking.facilityId, facilityId), lt(booking.start, to), gt(booking.end, from)))
		.orderBy(asc(booking.start))
		.all();
	return rows.map(({ b, campaignName, teamId, approvedRevisionId, campaignState }) => {
		const visible = canSeeBookingDetails(viewer, { teamId });
		return {
			...b,
			campaignId: visible ? b.campaignId : '',
			note: visible ? b.note : '',
			createdBy: visible ? b.createdBy : null,
			updatedBy: visible ? b.updatedBy : null,
			campaignName: visible ? campaignName : null,
			cost: visible
				? occupancyCost((b.end.getTime() - b.start.getTime()) / 1000, f.hourlyRate, f.currency)
				: null,
			currency: f.currency,
			teamId: visible ? teamId : '',
			// A newer revision awaits review: the slot still belongs to the one approved before.
			stale: visible && (approvedRevisionId !== b.revisionId || campaignState !== 'approved')
		};
	});
}
