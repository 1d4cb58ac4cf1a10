import { and, asc, eq, gt, lt } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import type { ClosureInput } from '../../schemas/booking';
import { canBook } from '../access';
import { writeTransaction, type Db } from '../db/open';
import { closure } from '../db/schema';
import { getFacility } from '../facilities';
import { refuse, type Outcome } from '../outcome';
import { collidingBooking, when } from './conflicts';

export function listClosures(db: Db, facilityId: string, from: Date, to: Date) {
	return db
		.select()
		.from(closure)
		.where(and(eq(closure.facilityId, facilityId), lt(closure.start, to), gt(closure.end, from)))
		.orderBy(asc(closure.start))
		.all();
}

/** Closes the tunnel for a time; refused while an active slot lies in it. */
export function createClosure(
	db: Db,
	viewer: SessionUser,
	facilityId: string,
	input: ClosureInput
): Outcome<{ id: string }> {
	if (!canBook(viewer)) return refuse('forbidden', 'Only operators and admins enter closures.');
	return writeTransaction(db, (tx) => {
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
	});
}
