import { eq, inArray } from 'drizzle-orm';
import { writeTransaction, type Db } from '../db/open';
import { signInThrottle } from '../db/schema';

/**
 * Failed sign-ins are counted per account-and-address pair, and per address over all accounts
 * with a far larger allowance (OWASP Authentication Cheat Sheet, "Login Throttling"; OWASP
 * Blocking Brute Force Attacks). Past a free allowance each further failure locks the key for
 * twice as long as the last, up to a ceiling: guessing one account from one place slows to a
 * crawl, spraying many accounts from one place is capped, and nobody elsewhere can lock a user
 * out of an account by failing on purpose.
 */
export const THROTTLE = {
	window_ms: 15 * 60_000,
	freeFailuresPerPair: 5,
	freeFailuresPerAddress: 100,
	firstLock_ms: 30_000,
	maxLock_ms: 15 * 60_000
} as const;

export type ThrottleKeys = { pair: string; address: string };

/**
 * The client address is what adapter-node reports: the socket's peer, or the proxy's header
 * when the deployment names it (ADDRESS_HEADER, XFF_DEPTH).
 */
export function throttleKeys(email: string, clientAddress: string): ThrottleKeys {
	return {
		pair: `pair:${email.trim().toLowerCase()}|${clientAddress}`,
		address: `address:${clientAddress}`
	};
}

/** Seconds until a sign-in for these keys may be tried again; 0 when it may be tried now. */
export function retryAfterSeconds(db: Db, keys: ThrottleKeys, now = Date.now()): number {
	const rows = db
		.select({ lockedUntil: signInThrottle.lockedUntil })
		.from(signInThrottle)
		.where(inArray(signInThrottle.key, [keys.pair, keys.address]))
		.all();
	const until = Math.max(0, ...rows.map((r) => r.lockedUntil?.getTime() ?? 0));
	return until > now ? Math.ceil((until - now) / 1000) : 0;
}

export function recordFailedSignIn(db: Db, keys: ThrottleKeys, now = Date.now()): void {
	writeTransaction(db, (tx) => {
		for (const [key, free] of [
			[keys.pair, THROTTLE.freeFailuresPerPair],
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

/** A correct password clears the pair's count; the address keeps its own. */
export function recordSuccessfulSignIn(db: Db, keys: ThrottleKeys): void {
	db.delete(signInThrottle).where(eq(signInThrottle.key, keys.pair)).run();
}
