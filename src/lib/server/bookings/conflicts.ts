import { and, desc, eq, gt, lt, ne, sql } from 'drizzle-orm';
import { withinOpeningHours } from '../../booking/calendar';
import { ACTIVE_BOOKING_STATES, overlaps, type Interval } from '../../booking/rules';
import { utcMinute } from '../../format';
import type { DbOrTx } from '../db/open';
import { booking, closure, facility } from '../db/schema';
import { refuse, type Refusal } from '../outcome';

type FacilityRow = typeof facility.$inferSelect;

// Written as a literal so SQLite can match the partial index `booking_active_start`; with bound
// parameters it cannot prove the index's WHERE clause and would scan.
export const activeBooking = sql.raw(
	`"booking"."state" in (${ACTIVE_BOOKING_STATES.map((s) => `'${s}'`).join(', ')})`
);

export const when = (moment: Date) => `${utcMinute(moment)} UTC`;

/**
 * The active slot of the facility that meets [start, end), if any. Active slots never overlap,
 * so only the last one starting before `end` can reach into the interval: one index seek.
 */
export function collidingBooking(
	tx: DbOrTx,
	facilityId: string,
	slot: Interval,
	exceptId?: string
) {
	const candidates = tx
		.select()
		.from(booking)
		.where(
			and(
				eq(booking.facilityId, facilityId),
				activeBooking,
				lt(booking.start, new Date(slot.end)),
				exceptId ? ne(booking.id, exceptId) : undefined
			)
		)
		.orderBy(desc(booking.start))
		.limit(1)
		.all();
	return candidates.find((b) => overlaps(slot, { start: b.start.getTime(), end: b.end.getTime() }));
}

function collidingClosure(tx: DbOrTx, facilityId: string, slot: Interval) {
	return tx
		.select()
		.from(closure)
		.where(
			and(
				eq(closure.facilityId, facilityId),
				lt(closure.start, new Date(slot.end)),
				gt(closure.end, new Date(slot.start))
			)
		)
		.get();
}

/** Every rule a slot must meet, checked inside the write transaction; the first breach is returned. */
export function slotProblem(
	tx: DbOrTx,
	f: FacilityRow,
	slot: Interval,
	now: number,
	exceptId?: string
): Refusal | null {
	if (slot.end <= slot.start) return refuse('invalid', 'The slot must end after it starts.', 'end');
	if (slot.start < now) return refuse('invalid', 'The slot starts in the past.', 'start');
	if (!withinOpeningHours(slot, f.openingHours, f.timeZone)) {
		return refuse(
			'invalid',
			`The slot is outside ${f.name}'s opening hours (${f.timeZone}).`,
			'start'
		);
	}
	const shut = collidingClosure(tx, f.id, slot);
	if (shut)
		return refuse(
			'conflict',
			`The tunnel is closed then: ${shut.reason} (${when(shut.start)} to ${when(shut.end)}).`,
			'start'
		);
	const clash = collidingBooking(tx, f.id, slot, exceptId);
	if (clash)
		return refuse(
			'conflict',
			`The slot collides with booking ${clash.id} (${when(clash.start)} to ${when(clash.end)}).`,
			'start'
		);
	return null;
}
