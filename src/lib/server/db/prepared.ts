import type { Db } from './open';

/**
 * A query that most requests run, built by Drizzle and compiled by SQLite once per database
 * instead of on every call; `build` returns it prepared, with placeholders for what varies.
 */
export function preparedPerDatabase<T>(build: (db: Db) => T): (db: Db) => T {
	const prepared = new WeakMap<Db, T>();
	return (db) => {
		let found = prepared.get(db);
		if (found === undefined) {
			found = build(db);
			prepared.set(db, found);
		}
		return found;
	};
}
