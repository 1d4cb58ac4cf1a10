import { asc, eq } from 'drizzle-orm';
import type { SessionUser } from '../roles';
import { facilitySchema, type FacilityInput } from '../schemas/facility';
import { writeTransaction, type Db, type DbOrTx } from './db/open';
import { facility } from './db/schema';
import { refuse, type Outcome } from './outcome';
import { claimVersion, editableValues, type BaseVersion, type StaleRefusal } from './versions';

export type Facility = typeof facility.$inferSelect;

export function listFacilities(db: Db): Facility[] {
	return db.select().from(facility).orderBy(asc(facility.name)).all();
}

export function getFacility(db: DbOrTx, id: string): Facility | undefined {
	return db.select().from(facility).where(eq(facility.id, id)).get();
}

function nameTaken(db: DbOrTx, name: string, exceptId?: string): boolean {
	const other = db.select({ id: facility.id }).from(facility).where(eq(facility.name, name)).get();
	return !!other && other.id !== exceptId;
}

export function createFacility(
	db: Db,
	viewer: SessionUser,
	input: FacilityInput
): Outcome<{ id: string }> {
	return writeTransaction(db, (tx) => {
		if (nameTaken(tx, input.name))
			return refuse('conflict', 'A facility of this name exists.', 'name');
		const { id } = tx
			.insert(facility)
			.values({ ...input, updatedBy: viewer.id })
			.returning({ id: facility.id })
			.get();
		return { ok: true, id };
	});
}

/** Writes the facility if `base` is still its stored version (see `updateCampaign`). */
export function updateFacility(
	db: Db,
	viewer: SessionUser,
	id: string,
	input: FacilityInput,
	base: BaseVersion
): Outcome<{ version: number }> | StaleRefusal {
	return writeTransaction(db, (tx) => {
		const existing = getFacility(tx, id);
		if (!existing) return refuse('not-found', 'No such facility.');
		if (nameTaken(tx, input.name, id))
			return refuse('conflict', 'A facility of this name exists.', 'name');
		const values = editableValues(facilitySchema, existing);
		const claimed = claimVersion(tx, 'facility', existing, values, base, { by: viewer.id });
		if (!claimed.ok) return claimed;
		tx.update(facility)
			.set({ ...input, ...claimed.stamp })
			.where(eq(facility.id, id))
			.run();
		return { ok: true, version: claimed.stamp.version };
	});
}
