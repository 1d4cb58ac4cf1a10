import { asc, eq } from 'drizzle-orm';
import type { FacilityInput } from '../schemas/facility';
import type { Db, DbOrTx } from './db/open';
import { facility } from './db/schema';
import { refuse, type Outcome } from './outcome';

export type Facility = typeof facility.$inferSelect;

export function listFacilities(db: Db): Facility[] {
	return db.select().from(facility).orderBy(asc(facility.name)).all();
}

export function getFacility(db: DbOrTx, id: string): Facility | undefined {
	return db.select().from(facility).where(eq(facility.id, id)).get();
}

function nameTaken(db: Db, name: string, exceptId?: string): boolean {
	const other = db.select({ id: facility.id }).from(facility).where(eq(facility.name, name)).get();
	return !!other && other.id !== exceptId;
}

export function createFacility(db: Db, input: FacilityInput): Outcome<{ id: string }> {
	if (nameTaken(db, input.name))
		return refuse('conflict', 'A facility of this name exists.', 'name');
	const { id } = db.insert(facility).values(input).returning({ id: facility.id }).get();
	return { ok: true, id };
}

export function updateFacility(db: Db, id: string, input: FacilityInput): Outcome {
	if (!getFacility(db, id)) return refuse('not-found', 'No such facility.');
	if (nameTaken(db, input.name, id))
		return refuse('conflict', 'A facility of this name exists.', 'name');
	db.update(facility).set(input).where(eq(facility.id, id)).run();
	return { ok: true };
}
