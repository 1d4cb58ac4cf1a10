/**
 * A session ends after a day without requests, and a week after sign-in whatever its use, so a
 * copied token does not live for ever (OWASP Session Management Cheat Sheet, "Session
 * Expiration": idle and absolute timeouts).
 *
 * The idle limit is the token's own expiry, pushed forward by re-issuing the cookie. Re-issuing
 * on every response would cost an encryption per request, so a request re-issues it only once
 * the token is `SESSION_REFRESH_S` old: the idle limit then runs from the last re-issue, between
 * `SESSION_MAX_AGE_S − SESSION_REFRESH_S` and `SESSION_MAX_AGE_S` after the last request.
 */
export const SESSION_MAX_AGE_S = 24 * 3600;
export const SESSION_ABSOLUTE_S = 7 * 24 * 3600;
export const SESSION_REFRESH_S = 5 * 60;

/** Whether a session signed in at `signedInAt` (ms) is still inside its absolute lifetime. */
export function withinAbsoluteLifetime(signedInAt: number | undefined, now = Date.now()): boolean {
	return signedInAt !== undefined && now - signedInAt < SESSION_ABSOLUTE_S * 1000;
}

/** Whether a token issued at `issuedAt_s` (seconds) is old enough to be re-issued. */
export function refreshDue(issuedAt_s: number, now = Date.now()): boolean {
	return now - issuedAt_s * 1000 >= SESSION_REFRESH_S * 1000;
}
