import type { Cookies } from '@sveltejs/kit';
import { randomBytes } from 'node:crypto';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
	sessionCookieName,
	sessionUserOf,
	tokenReader
} from '../../src/lib/server/auth/session-cookie';
import {
	SESSION_ABSOLUTE_S,
	SESSION_MAX_AGE_S,
	SESSION_REFRESH_S
} from '../../src/lib/server/auth/session-lifetime';
import { decodeSessionToken, encodeSessionToken } from '../../src/lib/server/auth/session-token';
import { endSessions, setActive } from '../../src/lib/server/users';
import { addUser, tempDb } from './temp-db';

type Written = { name: string; value: string; options: Parameters<Cookies['set']>[2] };

/** A request's cookies: the ones sent, and what the response would set or delete. */
function cookiesSending(sent: Record<string, string>) {
	const written: Written[] = [];
	const deleted: string[] = [];
	const cookies: Cookies = {
		get: (name) => sent[name],
		getAll: () => Object.entries(sent).map(([name, value]) => ({ name, value })),
		set: (name, value, options) => void written.push({ name, value, options }),
		delete: (name) => void deleted.push(name),
		serialize: (name, value) => `${name}=${value}`
	};
	return { cookies, written, deleted };
}

const HOUR_MS = 3600_000;
const signedInAt = Date.UTC(2026, 11, 1, 8, 0, 0);

function world(origin = 'http://localhost') {
	const db = tempDb();
	const adminId = addUser(db, 'admin@example.org', ['admin']);
	const userId = addUser(db, 'aero@example.org', ['aerodynamicist']);
	const secret = randomBytes(32).toString('base64url');
	const url = new URL('/api/v1/me', origin);
	const name = sessionCookieName(url);
	const issue = (at: number, claims: Record<string, unknown> = {}) =>
		encodeSessionToken(
			{
				token: { sub: userId, sessionVersion: 1, signedInAt, ...claims },
				secret,
				salt: name,
				maxAge: SESSION_MAX_AGE_S
			},
			new Date(at)
		);
	const read = tokenReader();
	const request = (token: string, at: number) => {
		const jar = cookiesSending({ [name]: token });
		const user = sessionUserOf({ cookies: jar.cookies, url, db, secret }, at, read);
		return user.then((found) => ({ found, ...jar }));
	};
	return { db, adminId, userId, secret, name, issue, request };
}

describe('the session cookie', () => {
	it('signs in with a fresh token and leaves the cookie alone', async () => {
		const { userId, issue, request } = world();
		const token = await issue(signedInAt);
		const answer = await request(token, signedInAt + (SESSION_REFRESH_S * 1000) / 2);
		expect(answer.found?.id).toBe(userId);
		expect(answer.found?.roles).toEqual(['aerodynamicist']);
		expect(answer.written).toEqual([]);
		expect(answer.deleted).toEqual([]);
	});

	it('re-issues the token once it is as old as the refresh interval, keeping the sign-in time', async () => {
		const { secret, name, issue, request } = world();
		const token = await issue(signedInAt);
		const before = await request(token, signedInAt + SESSION_REFRESH_S * 1000 - 1000);
		expect(before.written).toEqual([]);

		const at = signedInAt + SESSION_REFRESH_S * 1000;
		const { written } = await request(token, at);
		expect(written).toHaveLength(1);
		const [cookie] = written;
		expect(cookie!.name).toBe(name);
		expect(cookie!.options).toMatchObject({
			path: '/',
			httpOnly: true,
			sameSite: 'lax',
			secure: false,
			expires: new Date(at + SESSION_MAX_AGE_S * 1000)
		});
		const fresh = await decodeSessionToken(
			{ token: cookie!.value, secret, salt: name },
			new Date(at)
		);
		expect(fresh).toMatchObject({
			iat: at / 1000,
			exp: at / 1000 + SESSION_MAX_AGE_S,
			// The absolute lifetime still runs from the sign-in.
			signedInAt,
			sessionVersion: 1
		});
	});

	it('ends at once when the sessions are ended or the account deactivated, though the token is held', async () => {
		const { db, adminId, userId, issue, request } = world();
		const token = await issue(signedInAt);
		expect((await request(token, signedInAt + 1000)).found).not.toBeNull();
		endSessions(db, userId);
		expect((await request(token, signedInAt + 2000)).found).toBeNull();

		const renewed = await issue(signedInAt, { sessionVersion: 2 });
		expect((await request(renewed, signedInAt + 3000)).found).not.toBeNull();
		setActive(db, userId, false, adminId);
		const answer = await request(renewed, signedInAt + 4000);
		expect(answer.found).toBeNull();
		// A revoked session is not kept alive by re-issuing.
		expect(answer.written).toEqual([]);
	});

	it('ends after a day without requests, though the token is held, and drops the cookie', async () => {
		const { issue, request } = world();
		const token = await issue(signedInAt);
		expect((await request(token, signedInAt + 1000)).found).not.toBeNull();
		const idle = await request(token, signedInAt + SESSION_MAX_AGE_S * 1000);
		expect(idle.found).toBeNull();
		expect(idle.deleted).toHaveLength(1);
	});

	it('ends a week after sign-in however recently the token was re-issued', async () => {
		const { issue, request } = world();
		const end = signedInAt + SESSION_ABSOLUTE_S * 1000;
		const lastReissue = await issue(end - HOUR_MS);
		expect((await request(lastReissue, end - 1000)).found).not.toBeNull();
		expect((await request(lastReissue, end)).found).toBeNull();
	});

	it('refuses a token from another secret or cookie name, and a made-up one', async () => {
		const { userId, name, request } = world();
		const other = (secret: string, salt: string) =>
			encodeSessionToken(
				{
					token: { sub: userId, sessionVersion: 1, signedInAt },
					secret,
					salt,
					maxAge: SESSION_MAX_AGE_S
				},
				new Date(signedInAt)
			);
		for (const token of [
			await other(randomBytes(32).toString('base64url'), name),
			await other(randomBytes(32).toString('base64url'), `__Secure-${name}`),
			'not.a.token.at.all'
		]) {
			const answer = await request(token, signedInAt + 1000);
			expect(answer.found).toBeNull();
			expect(answer.deleted).toEqual([name]);
		}
	});

	it('is Secure with the __Secure- name over https', async () => {
		const { name, issue, request } = world('https://tunnelwright.example.org');
		expect(name).toBe('__Secure-authjs.session-token');
		const token = await issue(signedInAt);
		const { found, written } = await request(token, signedInAt + SESSION_REFRESH_S * 1000);
		expect(found).not.toBeNull();
		expect(written[0]?.options.secure).toBe(true);
	});
});

describe('held tokens', () => {
	it('decrypts a token once while it is held, and again after it was pushed out', async () => {
		const { secret, name, issue } = world();
		const read = tokenReader(1);
		const first = await issue(signedInAt);
		const second = await issue(signedInAt + 1000);
		const at = signedInAt + 2000;
		const once = await read(first, secret, name, at);
		expect(once).not.toBeNull();
		expect(await read(first, secret, name, at)).toBe(once);
		await read(second, secret, name, at);
		const again = await read(first, secret, name, at);
		expect(again).toEqual(once);
		expect(again).not.toBe(once);
	});
});

describe('the token format', () => {
	// Tokens written before the app had its own codec came from Auth.js's default one; the
	// two must read each other's, or an upgrade would sign everyone out.
	const authCore = createRequire(
		createRequire(import.meta.url).resolve('@auth/sveltekit/package.json')
	);
	const authJwt = () =>
		import(authCore.resolve('@auth/core/jwt')) as Promise<{
			encode: (params: object) => Promise<string>;
			decode: (params: object) => Promise<Record<string, unknown> | null>;
		}>;

	it('reads the tokens Auth.js writes, and Auth.js reads ours', async () => {
		const { encode, decode } = await authJwt();
		const secret = randomBytes(32).toString('base64url');
		const salt = 'authjs.session-token';
		const token = { sub: 'u1', sessionVersion: 3, signedInAt };
		const theirs = await encode({ token, secret, salt, maxAge: SESSION_MAX_AGE_S });
		expect(await decodeSessionToken({ token: theirs, secret, salt })).toMatchObject(token);
		const ours = await encodeSessionToken({ token, secret, salt, maxAge: SESSION_MAX_AGE_S });
		expect(await decode({ token: ours, secret, salt })).toMatchObject(token);
	});
});
