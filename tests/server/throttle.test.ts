import { describe, expect, it } from 'vitest';
import {
	THROTTLE,
	recordFailedSignIn,
	recordSuccessfulSignIn,
	retryAfterSeconds,
	throttleKeys
} from '../../src/lib/server/auth/throttle';
import { tempDb } from './temp-db';

const t0 = Date.UTC(2026, 11, 1, 9, 0, 0);
const failTimes = (db: ReturnType<typeof tempDb>, email: string, address: string, n: number) => {
	for (let i = 0; i < n; i++) recordFailedSignIn(db, throttleKeys(email, address), t0);
};

describe('sign-in throttle', () => {
	it('lets the free failures through, then locks with a doubling wait', () => {
		const db = tempDb();
		const keys = throttleKeys('Someone@Example.org', '192.0.2.7');
		for (let i = 0; i < THROTTLE.freeFailuresPerPair; i++) {
			recordFailedSignIn(db, keys, t0 + i);
			expect(retryAfterSeconds(db, keys, t0 + i)).toBe(0);
		}
		recordFailedSignIn(db, keys, t0 + 10);
		expect(retryAfterSeconds(db, keys, t0 + 10)).toBe(THROTTLE.firstLock_ms / 1000);
		recordFailedSignIn(db, keys, t0 + 20);
		expect(retryAfterSeconds(db, keys, t0 + 20)).toBe((2 * THROTTLE.firstLock_ms) / 1000);
		expect(retryAfterSeconds(db, keys, t0 + 20 + 2 * THROTTLE.firstLock_ms)).toBe(0);
	});

	it('keys e-mails case-insensitively', () => {
		expect(throttleKeys('Someone@Example.org', '192.0.2.7').pair).toBe(
			throttleKeys('someone@example.org', '192.0.2.7').pair
		);
	});

	it('cannot be used to lock a user out from another address', () => {
		const db = tempDb();
		failTimes(db, 'victim@example.org', '203.0.113.9', 30);
		expect(retryAfterSeconds(db, throttleKeys('victim@example.org', '203.0.113.9'), t0)).toBe(
			THROTTLE.maxLock_ms / 1000
		);
		// The owner, elsewhere, signs in as usual.
		expect(retryAfterSeconds(db, throttleKeys('victim@example.org', '192.0.2.7'), t0)).toBe(0);
	});

	it('lets the people sharing one address go on while one of them is locked', () => {
		const db = tempDb();
		failTimes(db, 'mistyper@example.org', '192.0.2.50', THROTTLE.freeFailuresPerPair + 1);
		expect(
			retryAfterSeconds(db, throttleKeys('mistyper@example.org', '192.0.2.50'), t0)
		).toBeGreaterThan(0);
		expect(retryAfterSeconds(db, throttleKeys('colleague@example.org', '192.0.2.50'), t0)).toBe(0);
	});

	it('locks an address that sprays many accounts, far past one account’s allowance', () => {
		const db = tempDb();
		for (let i = 0; i < THROTTLE.freeFailuresPerAddress; i++)
			failTimes(db, `user${i}@example.org`, '203.0.113.9', 1);
		expect(retryAfterSeconds(db, throttleKeys('fresh@example.org', '203.0.113.9'), t0)).toBe(0);
		failTimes(db, 'one-more@example.org', '203.0.113.9', 1);
		expect(retryAfterSeconds(db, throttleKeys('fresh@example.org', '203.0.113.9'), t0)).toBe(
			THROTTLE.firstLock_ms / 1000
		);
		expect(THROTTLE.freeFailuresPerAddress).toBeGreaterThanOrEqual(
			10 * THROTTLE.freeFailuresPerPair
		);
	});

	it('caps the lock and forgets failures once the window has passed', () => {
		const db = tempDb();
		const keys = throttleKeys('a@example.org', '192.0.2.1');
		failTimes(db, 'a@example.org', '192.0.2.1', 40);
		expect(retryAfterSeconds(db, keys, t0)).toBe(THROTTLE.maxLock_ms / 1000);
		const later = t0 + THROTTLE.window_ms + THROTTLE.maxLock_ms;
		recordFailedSignIn(db, keys, later);
		expect(retryAfterSeconds(db, keys, later)).toBe(0);
	});

	it('clears the pair’s count on success', () => {
		const db = tempDb();
		const keys = throttleKeys('a@example.org', '192.0.2.1');
		failTimes(db, 'a@example.org', '192.0.2.1', THROTTLE.freeFailuresPerPair + 1);
		recordSuccessfulSignIn(db, keys);
		expect(retryAfterSeconds(db, keys, t0)).toBe(0);
	});
});
