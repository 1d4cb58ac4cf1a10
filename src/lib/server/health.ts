import type { Db } from './db/open';
import { preparedPerDatabase } from './db/prepared';

const probe = preparedPerDatabase((db) => db.$client.prepare('SELECT 1').pluck());

/** Whether the database answers a query: what a deployment's readiness check asks. */
export function databaseReachable(db: Db): boolean {
	try {
		return probe(db).get() === 1;
	} catch {
		return false;
	}
}
