/**
 * A session ends after a day without requests (the token's expiry slides with use), and a week
 * after sign-in whatever its use, so a copied token does not live for ever (OWASP Session
 * Management Cheat Sheet, "Session Expiration": idle and absolute timeouts).
 */
export const SESSION_MAX_AGE_S = 24 * 3600;
export const SESSION_ABSOLUTE_S = 7 * 24 * 3600;

/** Whether a session signed in at `signedInAt` (ms) is still inside its absolute lifetime. */
export function withinAbsoluteLifetime(signedInAt: number | undefined, now = Date.now()): boolean {
	return signedInAt !== undefined && now - signedInAt < SESSION_ABSOLUTE_S * 1000;
}
