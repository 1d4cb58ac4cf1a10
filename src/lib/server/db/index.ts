import { env } from '$env/dynamic/private';
import { databasePathFromEnv, migrateDatabase, openDatabase, type Db } from './open';

export type { Db } from './open';

let instance: Db | undefined;

/** The app's database, opened and migrated on first use (start-up, via hooks `init`). */
export function getDb(): Db {
	if (!instance) {
		instance = openDatabase(databasePathFromEnv(env));
		migrateDatabase(instance);
	}
	return instance;
}
