import type { Database, Statement } from 'better-sqlite3';
import type { Db } from './db/open';

const probes = new WeakMap<Database, Statement>();

/** Whether the database answers a query: what a deployment's readiness check asks. */
export function databaseReachable(db: Db): boolean {
	try {
		let probe = probes.get(db.$client);
		if (!probe) {
			probe = db.$client.prepare('SELECT 1').pluck();
			probes.set(db.$client, probe);
		}
		return probe.get() === 1;
	} catch {
		return false;
	}
}
