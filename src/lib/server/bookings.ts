import { and, asc, desc, eq, gt, inArray, lt, ne, sql } from 'drizzle-orm';
import { occupancyCost } from '../calc';
import { utcMinute } from '../format';
import { withinOpeningHours, proposeSlots } from '../booking/calendar';
import { ACTIVE_BOOKING_STATES, type BookingState, type Interval } from '../booking/rules';
import type { SessionUser } from '../roles';
import type { BookingChange, BookingInput, ClosureInput } from '../schemas/booking';
import type { Db, DbOrTx } from './db/open';
import {
	booking,
	campaign,
	campaignRevision,
	closure,
	facility,
	user,
	userRole
} from './db/schema';
import { getFacility } from './facilities';
import { enqueueMail } from './mail/outbox';
import { refuse, type Outcome } from './outcome';

export type Booking = typeof booking.$inferSelect;
type FacilityRow = typeof facility.$inferSelect;

const canBook = (u: SessionUser) => u.roles.includes('operator') || u.roles.includes('admin');
const isStaff = (u: SessionUser) => canBook(u) || u.roles.includes('reviewer');
// Written as a literal so SQLite can match the partial index `booking_active_start`; with bound
// parameters it cannot prove the index's WHERE clause and would scan.
export const activeBooking = sql.raw(
	`"booking"."state" in (${ACTIVE_BOOKING_STATES.map((s) => `'${s}'`).join(', ')})`
);
const when = (moment: Date) => `${utcMinute(moment)} UTC`;

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
	return candidates.find((b) => b.end.getTime() > slot.start);
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
function slotProblem(tx: DbOrTx, f: FacilityRow, slot: Interval, now: number, exceptId?: string) {
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

function notify(
	tx: DbOrTx,
	c: { id: string; name: string; ownerId: string },
	subject: string,
	text: string,
	origin: string
) {
	const owner = tx.select({ email: user.email }).from(user).where(eq(user.id, c.ownerId)).get();
	const operators = tx
		.select({ email: user.email })
		.from(userRole)
		.innerJoin(user, eq(user.id, userRole.userId))
		.where(and(eq(userRole.role, 'operator'), eq(user.active, true)))
		.all()
		.map((r) => r.email);
	const to = [...new Set([owner?.email, ...operators].filter((e): e is string => !!e))];
	if (to.length)
		enqueueMail(tx, {
			kind: 'booking',
			to,
			subject,
			text: `${text}\n\nCampaign: ${origin}/campaigns/${c.id}`
		});
}

export function createBooking(
	db: Db,
	viewer: SessionUser,
	facilityId: string,
	input: BookingInput,
	origin: string,
	now = Date.now()
): Outcome<{ id: string }> {
	if (!canBook(viewer)) return refuse('forbidden', 'Only operators and admins book tunnel time.');
	return db.transaction(
		(tx) => {
			const f = getFacility(tx, facilityId);
			if (!f) return refuse('not-found', 'No such facility.');
			const c = tx.select().from(campaign).where(eq(campaign.id, input.campaignId)).get();
			if (!c) return refuse('invalid', 'No such campaign.', 'campaignId');
			if (!c.approvedRevisionId)
				return refuse(
					'conflict',
					'Only a campaign with an approved revision can be booked.',
					'campaignId'
				);
			if (c.facilityId !== facilityId)
				return refuse('invalid', `That campaign is planned for another facility.`, 'campaignId');
			const slot = { start: input.start.getTime(), end: input.end.getTime() };
			const problem = slotProblem(tx, f, slot, now);
			if (problem) return problem;
			const { id } = tx
				.insert(booking)
				.values({
					facilityId,
					campaignId: c.id,
					revisionId: c.approvedRevisionId,
					start: input.start,
					end: input.end,
					note: input.note,
					createdBy: viewer.id
				})
				.returning({ id: booking.id })
				.get();
			notify(
				tx,
				c,
				`Booked: ${c.name}, ${when(input.start)}`,
				`${f.name} is booked for “${c.name}” from ${when(input.start)} to ${when(input.end)}.`,
				origin
			);
			return { ok: true as const, id };
		},
		{ behavior: 'immediate' }
	);
}

const NEXT_STATES: Record<BookingState, readonly BookingState[]> = {
	pencilled: ['confirmed', 'cancelled'],
	confirmed: ['completed', 'cancelled', 'pencilled'],
	completed: [],
	cancelled: []
};

/** Moves a slot, changes its state (confirm, complete, cancel) or its note. */
export function changeBooking(
	db: Db,
	viewer: SessionUser,
	bookingId: string,
	change: BookingChange,
	origin: string,
	now = Date.now()
): Outcome {
	if (!canBook(viewer)) return refuse('forbidden', 'Only operators and admins change bookings.');
	return db.transaction(
		(tx) => {
			const b = tx.select().from(booking).where(eq(booking.id, bookingId)).get();
			if (!b) return refuse('not-found', 'No such booking.');
			const f = getFacility(tx, b.facilityId)!;
			const c = tx.select().from(campaign).where(eq(campaign.id, b.campaignId)).get()!;
			if (
				change.state &&
				change.state !== b.state &&
				!NEXT_STATES[b.state].includes(change.state)
			) {
				return refuse('conflict', `A ${b.state} booking cannot become ${change.state}.`, 'state');
			}
			const moved = change.start || change.end;
			const slot = {
				start: (change.start ?? b.start).getTime(),
				end: (change.end ?? b.end).getTime()
			};
			if (moved) {
				if (!ACTIVE_BOOKING_STATES.includes(b.state))
					return refuse('conflict', `A ${b.state} booking cannot be moved.`, 'start');
				const problem = slotProblem(tx, f, slot, now, b.id);
				if (problem) return problem;
			}
			tx.update(booking)
				.set({
					start: new Date(slot.start),
					end: new Date(slot.end),
					state: change.state ?? b.state,
					note: change.note ?? b.note,
					updatedAt: new Date(now)
				})
				.where(eq(booking.id, b.id))
				.run();
			if (moved)
				notify(
					tx,
					c,
					`Moved: ${c.name}, now ${when(new Date(slot.start))}`,
					`The ${f.name} slot for “${c.name}” moved to ${when(new Date(slot.start))} – ${when(new Date(slot.end))}.`,
					origin
				);
			if (change.state === 'cancelled')
				notify(
					tx,
					c,
					`Cancelled: ${c.name}, ${when(b.start)}`,
					`The ${f.name} slot for “${c.name}” on ${when(b.start)} is cancelled.`,
					origin
				);
			return { ok: true as const };
		},
		{ behavior: 'immediate' }
	);
}

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
	const teamIds = new Set(viewer.teams.map((t) => t.id));
	return rows.map(({ b, campaignName, teamId, approvedRevisionId, campaignState }) => {
		const visible = isStaff(viewer) || teamIds.has(teamId);
		return {
			...b,
			campaignId: visible ? b.campaignId : '',
			note: visible ? b.note : '',
			campaignName: visible ? campaignName : null,
			cost: visible
				? occupancyCost((b.end.getTime() - b.start.getTime()) / 1000, f.hourlyRate)
				: null,
			currency: f.currency,
			teamId: visible ? teamId : '',
			// A newer revision awaits review: the slot still belongs to the one approved before.
			stale: visible && (approvedRevisionId !== b.revisionId || campaignState !== 'approved')
		};
	});
}

export function listClosures(db: Db, facilityId: string, from: Date, to: Date) {
	return db
		.select()
		.from(closure)
		.where(and(eq(closure.facilityId, facilityId), lt(closure.start, to), gt(closure.end, from)))
		.orderBy(asc(closure.start))
		.all();
}

export function createClosure(
	db: Db,
	viewer: SessionUser,
	facilityId: string,
	input: ClosureInput
): Outcome<{ id: string }> {
	if (!canBook(viewer)) return refuse('forbidden', 'Only operators and admins enter closures.');
	return db.transaction(
		(tx) => {
			if (!getFacility(tx, facilityId)) return refuse('not-found', 'No such facility.');
			const clash = collidingBooking(tx, facilityId, {
				start: input.start.getTime(),
				end: input.end.getTime()
			});
			if (clash)
				return refuse(
					'conflict',
					`Booking ${clash.id} (${when(clash.start)} to ${when(clash.end)}) lies in that time; move or cancel it first.`,
					'start'
				);
			const { id } = tx
				.insert(closure)
				.values({ ...input, facilityId, createdBy: viewer.id })
				.returning({ id: closure.id })
				.get();
			return { ok: true as const, id };
		},
		{ behavior: 'immediate' }
	);
}

/** Campaigns with an approved revision for this facility, how long each needs and has booked. */
export function bookableCampaigns(db: Db, facilityId: string) {
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
			booked_ms: held.booked_ms
		})
		.from(campaign)
		.innerJoin(campaignRevision, eq(campaignRevision.id, campaign.approvedRevisionId))
		.leftJoin(held, eq(held.campaignId, campaign.id))
		.where(eq(campaign.facilityId, facilityId))
		.orderBy(asc(campaign.name))
		.all()
		.map(({ snapshot, booked_ms, ...c }) => ({
			...c,
			occupancy_s: snapshot.figures.occupancy.total_s,
			booked_s: (booked_ms ?? 0) / 1000
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

/** A campaign's slots, for its own page. */
export function campaignSlots(db: Db, campaignId: string) {
	return db
		.select()
		.from(booking)
		.where(eq(booking.campaignId, campaignId))
		.orderBy(asc(booking.start))
		.all();
}
