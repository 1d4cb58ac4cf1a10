import { eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import type { Db } from './db/open';
import { appSetting } from './db/schema';

/**
 * A secret generated on first use and kept in the database, so sessions signed with it survive
 * a restart even where no AUTH_SECRET is configured (the demo). Production sets AUTH_SECRET.
 */
export function storedSecret(db: Db, key: string): string {
	const existing = db.select().from(appSetting).where(eq(appSetting.key, key)).get();
	if (existing) return existing.value;
	db.insert(appSetting)
		.values({ key, value: randomBytes(32).toString('base64url') })
		.onConflictDoNothing()
		.run();
	return db.select().from(appSetting).where(eq(appSetting.key, key)).get()!.value;
}
