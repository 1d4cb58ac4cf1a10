import { eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/open';
import { signInThrottle } from '../db/schema';

/**
 * Failed sign-ins are counted per account and per client address. Past a free allowance each
 * further failure locks the key for twice as long as the last, up to a ceiling, so guessing
 * slows to a crawl while a person who mistyped twice is never held up.
 */
export const THROTTLE = {
	window_ms: 15 * 60_000,
	freeFailuresPerAccount: 5,
	freeFailuresPerAddress: 20,
	firstLock_ms: 30_000,
	maxLock_ms: 15 * 60_000
} as const;

export type ThrottleKeys = { account: string; address: string };

export function throttleKeys(email: string, clientAddress: string): ThrottleKeys {
	return { account: `account:${email.trim().toLowerCase()}`, address: `address:${clientAddress}` };
}

/** Seconds until a sign-in for these keys may be tried again; 0 when it may be tried now. */
export function retryAfterSeconds(db: Db, keys: ThrottleKeys, now = Date.now()): number {
	const rows = db
		.select({ lockedUntil: signInThrottle.lockedUntil })
		.from(signInThrottle)
		.where(inArray(signInThrottle.key, [keys.account, keys.address]))
		.all();
	const until = Math.max(0, ...rows.map((r) => r.lockedUntil?.getTime() ?? 0));
	return until > now ? Math.ceil((until - now) / 1000) : 0;
}

export function recordFailedSignIn(db: Db, keys: ThrottleKeys, now = Date.now()): void {
	db.transaction((tx) => {
		for (const [key, free] of [
			[keys.account, THROTTLE.freeFailuresPerAccount],
			[keys.address, THROTTLE.freeFailuresPerAddress]
		] as const) {
			const row = tx.select().from(signInThrottle).where(eq(signInThrottle.key, key)).get();
			const windowOpen = row && now - row.windowStartedAt.getTime() < THROTTLE.window_ms;
			const failures = windowOpen ? row.failures + 1 : 1;
			const windowStartedAt = new Date(windowOpen ? row.windowStartedAt.getTime() : now);
			const excess = failures - free;
			const lockedUntil =
				excess > 0
					? new Date(now + Math.min(THROTTLE.maxLock_ms, THROTTLE.firstLock_ms * 2 ** (excess - 1)))
					: null;
			tx.insert(signInThrottle)
				.values({ key, failures, windowStartedAt, lockedUntil })
				.onConflictDoUpdate({
					target: signInThrottle.key,
					set: { failures, windowStartedAt, lockedUntil }
				})
				.run();
		}
	});
}

/** A correct password clears the account's count; the address keeps its own. */
export function recordSuccessfulSignIn(db: Db, keys: ThrottleKeys): void {
	db.delete(signInThrottle).where(eq(signInThrottle.key, keys.account)).run();
}
