import { and, asc, eq, gt, lt } from 'drizzle-orm';
import { localParts } from '../booking/week';
import type { BookingState } from '../booking/rules';
import { activeBooking } from './bookings';
import type { Db } from './db/open';
import { booking, campaign } from './db/schema';
import { listFacilities } from './facilities';

/** How far ahead the operator's schedule lists booked time. */
export const SCHEDULE_WEEKS = 6;

export type ScheduledSlot = {
	id: string;
	campaignId: string;
	campaignName: string;
	state: BookingState;
	/** Wall-clock times in the facility's zone, hh:mm. */
	from: string;
	to: string;
};
export type ScheduleDay = { day: string; label: string; slots: ScheduledSlot[] };
export type FacilitySchedule = {
	id: string;
	name: string;
	timeZone: string;
	booked_s: number;
	days: ScheduleDay[];
};

/**
 * The pencilled and confirmed slots of every facility that meet [from, from + SCHEDULE_WEEKS),
 * grouped by facility and by day in that facility's time zone, so a fully booked week shows as
 * booked. Names every team's campaigns: for operators and admins, whom the caller checks.
 */
export function upcomingSchedule(db: Db, from: Date): FacilitySchedule[] {
	const to = new Date(from.getTime() + SCHEDULE_WEEKS * 7 * 86_400_000);
	const rows = db
		.select({
			id: booking.id,
			facilityId: booking.facilityId,
			campaignId: booking.campaignId,
			campaignName: campaign.name,
			state: booking.state,
			start: booking.start,
			end: booking.end
		})
		.from(booking)
		.innerJoin(campaign, eq(campaign.id, booking.campaignId))
		.where(and(activeBooking, gt(booking.end, from), lt(booking.start, to)))
		.orderBy(asc(booking.start))
		.all();
	return listFacilities(db).map((f) => {
		const days: ScheduleDay[] = [];
		let booked_ms = 0;
		for (const r of rows.filter((r) => r.facilityId === f.id)) {
			booked_ms += r.end.getTime() - r.start.getTime();
			// Slots lie inside one opening window, so the local day they start on is theirs.
			const start = localParts(r.start, f.timeZone);
			const last = days.at(-1);
			const day =
				last?.day === start.day ? last : { day: start.day, label: start.dayLabel, slots: [] };
			if (day !== last) days.push(day);
			day.slots.push({
				id: r.id,
				campaignId: r.campaignId,
				campaignName: r.campaignName,
				state: r.state,
				from: start.label,
				to: localParts(r.end, f.timeZone).label
			});
		}
		return { id: f.id, name: f.name, timeZone: f.timeZone, booked_s: booked_ms / 1000, days };
	});
}
