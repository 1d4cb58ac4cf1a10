import type { Cookies } from '@sveltejs/kit';
import type { SessionUser } from '../../roles';
import type { Db } from '../db/open';
import { sessionUser } from '../users';
import { refreshDue, SESSION_MAX_AGE_S, withinAbsoluteLifetime } from './session-lifetime';
import { decodeSessionToken, encodeSessionToken, type SessionPayload } from './session-token';

/** Over https the session cookie is Secure and carries the `__Secure-` prefix (RFC 6265bis). */
export const secureCookies = (url: URL) => url.protocol === 'https:';

/** Auth.js's name for the session cookie; the name also salts the token's key. */
export const sessionCookieName = (url: URL) =>
	`${secureCookies(url) ? '__Secure-' : ''}authjs.session-token`;

const cookieOptions = (url: URL) =>
	({ path: '/', httpOnly: true, sameSite: 'lax', secure: secureCookies(url) }) as const;

/** What a session token says, as the hooks use it. */
export type SessionClaims = {
	payload: SessionPayload;
	userId: string;
	sessionVersion: number;
	/** When the user signed in (ms), for the absolute lifetime. */
	signedInAt: number;
	issuedAt_s: number;
	expiresAt_s: number;
};

function claimsOf(payload: SessionPayload | null): SessionClaims | null {
	const { sub, sessionVersion, signedInAt, iat, exp } = payload ?? {};
	if (typeof sub !== 'string' || !sub) return null;
	if (typeof sessionVersion !== 'number' || typeof signedInAt !== 'number') return null;
	if (typeof iat !== 'number' || typeof exp !== 'number') return null;
	return {
		payload: payload!,
		userId: sub,
		sessionVersion,
		signedInAt,
		issuedAt_s: iat,
		expiresAt_s: exp
	};
}

export type TokenReader = (
	token: string,
	secret: string,
	salt: string,
	now_ms: number
) => Promise<SessionClaims | null>;

/**
 * Reads tokens, holding the most recently used `capacity` of them decoded. What a token says
 * never changes, so holding it is safe as long as its expiry is checked on each use; whether
 * the session still stands is the user row's to say, and that is read on every request. Only
 * tokens that decrypted are held, so made-up tokens cannot push real ones out.
 */
export function tokenReader(capacity = 5000): TokenReader {
	const held = new Map<string, SessionClaims>();
	return async (token, secret, salt, now_ms) => {
		const id = `${salt}\n${token}`;
		let claims = held.get(id) ?? null;
		if (claims) held.delete(id);
		else {
			const payload = await decodeSessionToken({ token, secret, salt }, new Date(now_ms)).catch(
				() => null
			);
			claims = claimsOf(payload);
		}
		if (!claims || claims.expiresAt_s * 1000 <= now_ms) return null;
		// Re-inserted last: the map's order is the order of use, oldest first.
		held.set(id, claims);
		if (held.size > capacity) held.delete(held.keys().next().value!);
		return claims;
	};
}

const readToken = tokenReader();

export type SessionRequest = { cookies: Cookies; url: URL; db: Db; secret: string };

/**
 * The user a request's session cookie signs in, or null when there is none, it is unreadable
 * or expired, past its absolute lifetime, or the account's sessions were ended since (read from
 * the user row on every request, so ending sessions, deactivating and a new password count at
 * once). A token old enough is re-issued with a fresh expiry; see `session-lifetime.ts`.
 * Tokens are far below a cookie's 4 kB (names and e-mails are bounded), so Auth.js never splits
 * them into numbered chunks and only the one cookie is read.
 */
export async function sessionUserOf(
	{ cookies, url, db, secret }: SessionRequest,
	now = Date.now(),
	read: TokenReader = readToken
): Promise<SessionUser | null> {
	const name = sessionCookieName(url);
	const token = cookies.get(name);
	if (!token) return null;
	const claims = await read(token, secret, name, now);
	if (!claims) {
		cookies.delete(name, cookieOptions(url));
		return null;
	}
	if (!withinAbsoluteLifetime(claims.signedInAt, now)) return null;
	const found = sessionUser(db, claims.userId, claims.sessionVersion);
	if (found && refreshDue(claims.issuedAt_s, now)) {
		const fresh = await encodeSessionToken(
			{ token: claims.payload, secret, salt: name, maxAge: SESSION_MAX_AGE_S },
			new Date(now)
		);
		cookies.set(name, fresh, {
			...cookieOptions(url),
			expires: new Date(now + SESSION_MAX_AGE_S * 1000)
		});
	}
	return found;
}
