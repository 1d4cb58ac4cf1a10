import { asc } from 'drizzle-orm';
import type { Db } from './db/open';
import { facility } from './db/schema';

export type Facility = typeof facility.$inferSelect;

export function listFacilities(db: Db): Facility[] {
	return db.select().from(facility).orderBy(asc(facility.name)).all();
}
