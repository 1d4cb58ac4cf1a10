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

describe('sign-in throttle', () => {
	it('lets the free failures through, then locks with a doubling wait', () => {
		const db = tempDb();
		const keys = throttleKeys('Someone@Example.org', '192.0.2.7');
		for (let i = 0; i < THROTTLE.freeFailuresPerAccount; i++) {
			recordFailedSignIn(db, keys, t0 + i);
			expect(retryAfterSeconds(db, keys, t0 + i)).toBe(0);
		}
		recordFailedSignIn(db, keys, t0 + 10);
		expect(retryAfterSeconds(db, keys, t0 + 10)).toBe(THROTTLE.firstLock_ms / 1000);
		recordFailedSignIn(db, keys, t0 + 20);
		expect(retryAfterSeconds(db, keys, t0 + 20)).toBe((2 * THROTTLE.firstLock_ms) / 1000);
		expect(retryAfterSeconds(db, keys, t0 + 20 + 2 * THROTTLE.firstLock_ms)).toBe(0);
	});

	it('keys accounts case-insensitively and counts the address separately', () => {
		const db = tempDb();
		const a = throttleKeys('Someone@Example.org', '192.0.2.7');
		const b = throttleKeys('someone@example.org', '198.51.100.1');
		expect(a.account).toBe(b.account);
		for (let i = 0; i <= THROTTLE.freeFailuresPerAccount; i++) recordFailedSignIn(db, a, t0);
		// Same account from another address: still locked, the account key carries the lock.
		expect(retryAfterSeconds(db, b, t0)).toBeGreaterThan(0);
		// Another account from the first address: the address is still under its own allowance.
		expect(retryAfterSeconds(db, throttleKeys('other@example.org', '192.0.2.7'), t0)).toBe(0);
	});

	it('locks an address that tries many accounts', () => {
		const db = tempDb();
		for (let i = 0; i <= THROTTLE.freeFailuresPerAddress; i++) {
			recordFailedSignIn(db, throttleKeys(`user${i}@example.org`, '203.0.113.9'), t0);
		}
		expect(retryAfterSeconds(db, throttleKeys('fresh@example.org', '203.0.113.9'), t0)).toBe(
			THROTTLE.firstLock_ms / 1000
		);
	});

	it('caps the lock and forgets failures once the window has passed', () => {
		const db = tempDb();
		const keys = throttleKeys('a@example.org', '192.0.2.1');
		for (let i = 0; i < 40; i++) recordFailedSignIn(db, keys, t0);
		expect(retryAfterSeconds(db, keys, t0)).toBe(THROTTLE.maxLock_ms / 1000);
		const later = t0 + THROTTLE.window_ms + THROTTLE.maxLock_ms;
		recordFailedSignIn(db, keys, later);
		expect(retryAfterSeconds(db, keys, later)).toBe(0);
	});

	it('clears the account count on success', () => {
		const db = tempDb();
		const keys = throttleKeys('a@example.org', '192.0.2.1');
		for (let i = 0; i <= THROTTLE.freeFailuresPerAccount; i++) recordFailedSignIn(db, keys, t0);
		recordSuccessfulSignIn(db, keys);
		expect(retryAfterSeconds(db, throttleKeys('a@example.org', '192.0.2.99'), t0)).toBe(0);
	});
});
