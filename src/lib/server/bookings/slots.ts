import { asc, eq } from 'drizzle-orm';
import {
	ACTION_FOR_STATE,
	bookingTransition,
	type BookingAction,
	type BookingStep
} from '../../booking/workflow';
import type { SessionUser } from '../../roles';
import type { BookingChange, BookingInput } from '../../schemas/booking';
import { canBook, canReadCampaign } from '../access';
import { writeTransaction, type Db } from '../db/open';
import { booking, campaign } from '../db/schema';
import { acceptedQuoteFor } from '../billing/quotes';
import { getFacility } from '../facilities';
import { refuse, type Outcome } from '../outcome';
import { claimVersion, type BaseVersion, type StaleRefusal } from '../versions';
import { slotProblem, when } from './conflicts';
import { notifyBooking } from './notices';

export type Booking = typeof booking.$inferSelect;

/**
 * The slot if the viewer may change bookings and it exists (of `facilityId`, when given): the
 * check routes make before they read a request body.
 */
export function findBookingFor(
	db: Db,
	viewer: SessionUser,
	bookingId: string,
	facilityId?: string
): Outcome<{ booking: Booking }> {
	if (!canBook(viewer)) return refuse('forbidden', 'Only operators and admins change bookings.');
	const b = db.select().from(booking).where(eq(booking.id, bookingId)).get();
	if (!b || (facilityId && b.facilityId !== facilityId))
		return refuse('not-found', 'No such booking.');
	return { ok: true, booking: b };
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
	return writeTransaction(db, (tx) => {
		const f = getFacility(tx, facilityId);
		if (!f) return refuse('not-found', 'No such facility.');
		const c = tx.select().from(campaign).where(eq(campaign.id, input.campaignId)).get();
		// A campaign the booker may not see answers as one that does not exist.
		if (!c || !canReadCampaign(viewer, c))
			return refuse('invalid', 'No such campaign.', 'campaignId');
		if (!c.approvedRevisionId)
			return refuse(
				'conflict',
				'Only a campaign with an approved revision can be booked.',
				'campaignId'
			);
		if (c.facilityId !== facilityId)
			return refuse('invalid', `That campaign is planned for another facility.`, 'campaignId');
		if (f.quoteRequiredForBooking && !acceptedQuoteFor(tx, c.id, c.approvedRevisionId))
			return refuse(
				'conflict',
				`${f.name} books only campaigns whose client accepted a quote for the approved revision.`,
				'campaignId'
			);
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
				createdBy: viewer.id,
				updatedBy: viewer.id
			})
			.returning({ id: booking.id })
			.get();
		notifyBooking(
			tx,
			c,
			`Booked: ${c.name}, ${when(input.start)}`,
			`${f.name} is booked for “${c.name}” from ${when(input.start)} to ${when(input.end)}.`,
			origin
		);
		return { ok: true as const, id };
	});
}

/** The workflow steps a change asks for: a new state, a move, or both. */
function stepsOf(b: Booking, change: BookingChange): BookingAction[] {
	const steps: BookingAction[] = [];
	if (change.state && change.state !== b.state) steps.push(ACTION_FOR_STATE[change.state]);
	if (change.start || change.end) steps.push('move');
	return steps;
}

/** Moves a slot, changes its state (confirm, complete, cancel) or its note. */
export function changeBooking(
	db: Db,
	viewer: SessionUser,
	bookingId: string,
	change: BookingChange,
	base: BaseVersion,
	origin: string,
	now = Date.now()
): Outcome<{ version: number }> | StaleRefusal {
	if (!canBook(viewer)) return refuse('forbidden', 'Only operators and admins change bookings.');
	return writeTransaction(db, (tx) => {
		const b = tx.select().from(booking).where(eq(booking.id, bookingId)).get();
		if (!b) return refuse('not-found', 'No such booking.');
		const f = getFacility(tx, b.facilityId)!;
		const c = tx.select().from(campaign).where(eq(campaign.id, b.campaignId)).get()!;
		const steps = stepsOf(b, change);
		const refused = steps
			.map((action): BookingStep => bookingTransition(b.state, action, viewer))
			.find((step) => !step.ok);
		if (refused) return refused;
		const moved = steps.includes('move');
		const slot = {
			start: (change.start ?? b.start).getTime(),
			end: (change.end ?? b.end).getTime()
		};
		if (moved) {
			const problem = slotProblem(tx, f, slot, now, b.id);
			if (problem) return problem;
		}
		const claimed = claimVersion(tx, 'booking', b, bookingValues(b), base, {
			by: viewer.id,
			at: new Date(now)
		});
		if (!claimed.ok) return claimed;
		tx.update(booking)
			.set({
				start: new Date(slot.start),
				end: new Date(slot.end),
				state: change.state ?? b.state,
				note: change.note ?? b.note,
				...claimed.stamp
			})
			.where(eq(booking.id, b.id))
			.run();
		if (moved)
			notifyBooking(
				tx,
				c,
				`Moved: ${c.name}, now ${when(new Date(slot.start))}`,
				`The ${f.name} slot for “${c.name}” moved to ${when(new Date(slot.start))} – ${when(new Date(slot.end))}.`,
				origin
			);
		if (change.state === 'cancelled')
			notifyBooking(
				tx,
				c,
				`Cancelled: ${c.name}, ${when(b.start)}`,
				`The ${f.name} slot for “${c.name}” on ${when(b.start)} is cancelled.`,
				origin
			);
		return { ok: true as const, version: claimed.stamp.version };
	});
}

/** What a booking's edit history keeps: the slot as the calendar shows it. */
const bookingValues = (b: Booking) => ({
	start: b.start.toISOString(),
	end: b.end.toISOString(),
	state: b.state,
	note: b.note
});

/** A campaign's slots, for its own page. */
export function campaignSlots(db: Db, campaignId: string) {
	return db
		.select()
		.from(booking)
		.where(eq(booking.campaignId, campaignId))
		.orderBy(asc(booking.start))
		.all();
}
