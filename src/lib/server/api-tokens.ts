import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, sql } from 'drizzle-orm';
import {
	API_TOKEN_MAX_LIFETIME_DAYS,
	API_TOKEN_SCOPES,
	type ApiTokenInput,
	type ApiTokenScope,
	type ApiTokenState
} from '../schemas/api-token';
import type { Db } from './db/open';
import { apiToken, user } from './db/schema';
import { refuse, type Outcome } from './outcome';
import { sessionUser, type SessionUser } from './users';

/** Lets people and secret scanners tell a Tunnelwright token from other secrets at a glance. */
export const API_TOKEN_PREFIX = 'twt_';

/** lastUsedAt only needs to say roughly when; a busy client must not write on every call. */
const LAST_USED_RESOLUTION_MS = 60_000;
const DAY_MS = 86_400_000;

export type ApiTokenListing = {
	id: string;
	name: string;
	scopes: ApiTokenScope[];
	createdAt: Date;
	expiresAt: Date | null;
	lastUsedAt: Date | null;
	revokedAt: Date | null;
	state: ApiTokenState;
};

export type TokenAuthentication = { user: SessionUser; tokenId: string; scopes: ApiTokenScope[] };

const hashOf = (secret: string) => createHash('sha256').update(secret).digest('hex');

function stateOf(
	t: { expiresAt: Date | null; revokedAt: Date | null },
	now: number
): ApiTokenState {
	if (t.revokedAt) return 'revoked';
	return t.expiresAt && t.expiresAt.getTime() <= now ? 'expired' : 'active';
}

/** A new token for the viewer. The secret is returned here only; the database keeps its hash. */
export function createApiToken(
	db: Db,
	viewer: SessionUser,
	input: ApiTokenInput,
	now = Date.now()
): Outcome<{
	id: string;
	token: string;
	name: string;
	scopes: ApiTokenScope[];
	expiresAt: Date | null;
}> {
	const expiresAt = input.expiresAt ?? null;
	if (expiresAt && expiresAt.getTime() <= now) {
		return refuse('invalid', 'The expiry must lie in the future.', 'expiresAt');
	}
	if (expiresAt && expiresAt.getTime() > now + API_TOKEN_MAX_LIFETIME_DAYS * DAY_MS) {
		return refuse(
			'invalid',
			`A token may live at most ${API_TOKEN_MAX_LIFETIME_DAYS} days.`,
			'expiresAt'
		);
	}
	const scopes = API_TOKEN_SCOPES.filter((s) => input.scopes.includes(s));
	const token = API_TOKEN_PREFIX + randomBytes(32).toString('base64url');
	const created = db
		.insert(apiToken)
		.values({
			userId: viewer.id,
			name: input.name,
			tokenHash: hashOf(token),
			scopes,
			expiresAt,
			createdAt: new Date(now)
		})
		.returning({ id: apiToken.id })
		.get();
	return { ok: true, id: created.id, token, name: input.name, scopes, expiresAt };
}

/** The viewer's own tokens, newest first. */
export function listApiTokens(db: Db, viewer: SessionUser, now = Date.now()): ApiTokenListing[] {
	return db
		.select({
			id: apiToken.id,
			name: apiToken.name,
			scopes: apiToken.scopes,
			createdAt: apiToken.createdAt,
			expiresAt: apiToken.expiresAt,
			lastUsedAt: apiToken.lastUsedAt,
			revokedAt: apiToken.revokedAt
		})
		.from(apiToken)
		.where(eq(apiToken.userId, viewer.id))
		.orderBy(desc(apiToken.createdAt))
		.all()
		.map((t) => ({ ...t, state: stateOf(t, now) }));
}

/** Revokes one of the viewer's tokens; a second revocation keeps the first moment. */
export function revokeApiToken(db: Db, viewer: SessionUser, id: string, now = Date.now()): Outcome {
	const changed = db
		.update(apiToken)
		.set({ revokedAt: sql`coalesce(${apiToken.revokedAt}, ${now})` })
		.where(and(eq(apiToken.id, id), eq(apiToken.userId, viewer.id)))
		.run();
	return changed.changes === 1 ? { ok: true } : refuse('not-found', 'No such token.');
}

/**
 * Who a presented secret acts as, or null when it is unknown, revoked or expired, or its owner
 * can no longer sign in. The owner's roles and teams are read fresh, as for a session.
 */
export function authenticateApiToken(
	db: Db,
	secret: string,
	now = Date.now()
): TokenAuthentication | null {
	const row = db
		.select({
			id: apiToken.id,
			userId: apiToken.userId,
			scopes: apiToken.scopes,
			expiresAt: apiToken.expiresAt,
			lastUsedAt: apiToken.lastUsedAt,
			revokedAt: apiToken.revokedAt,
			sessionVersion: user.sessionVersion
		})
		.from(apiToken)
		.innerJoin(user, eq(user.id, apiToken.userId))
		.where(eq(apiToken.tokenHash, hashOf(secret)))
		.get();
	if (!row || stateOf(row, now) !== 'active') return null;
	const owner = sessionUser(db, row.userId, row.sessionVersion);
	if (!owner) return null;
	if (!row.lastUsedAt || now - row.lastUsedAt.getTime() >= LAST_USED_RESOLUTION_MS) {
		db.update(apiToken)
			.set({ lastUsedAt: new Date(now) })
			.where(eq(apiToken.id, row.id))
			.run();
	}
	return { user: owner, tokenId: row.id, scopes: row.scopes };
}
