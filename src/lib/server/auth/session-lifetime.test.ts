import { describe, expect, it } from 'vitest';
import { SESSION_ABSOLUTE_S, SESSION_MAX_AGE_S, withinAbsoluteLifetime } from './session-lifetime';

describe('session lifetime', () => {
	const signedIn = Date.UTC(2026, 11, 1, 8, 0, 0);

	it('keeps a session inside its absolute lifetime and ends it after, however it was used', () => {
		expect(withinAbsoluteLifetime(signedIn, signedIn + 1000)).toBe(true);
		expect(withinAbsoluteLifetime(signedIn, signedIn + SESSION_ABSOLUTE_S * 1000 - 1)).toBe(true);
		expect(withinAbsoluteLifetime(signedIn, signedIn + SESSION_ABSOLUTE_S * 1000)).toBe(false);
	});

	it('ends a token that does not say when it was signed in', () => {
		expect(withinAbsoluteLifetime(undefined, signedIn)).toBe(false);
	});

	it('has an idle limit shorter than the absolute one', () => {
		// Idle and absolute timeouts both apply (OWASP Session Management Cheat Sheet).
		expect(SESSION_MAX_AGE_S).toBeLessThan(SESSION_ABSOLUTE_S);
	});
});
