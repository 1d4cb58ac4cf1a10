import { isHttpError, type RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import type { ApiTokenScope } from '../../src/lib/schemas/api-token';
import { tokenScopeFor } from '../../src/lib/server/access';
import {
	authenticateApiToken,
	createApiToken,
	listApiTokens,
	revokeApiToken
} from '../../src/lib/server/api-tokens';
import { authenticateBearer } from '../../src/lib/server/auth/bearer';
import { createCampaign } from '../../src/lib/server/campaigns';
import type { Db } from '../../src/lib/server/db/open';
import { apiToken, user, userRole } from '../../src/lib/server/db/schema';
import * as campaignItem from '../../src/routes/api/v1/campaigns/[id]/+server';
import * as tokenItem from '../../src/routes/api/v1/tokens/[id]/+server';
import * as tokens from '../../src/routes/api/v1/tokens/+server';
import { callRoute as call } from './call-route';
import { campaignWorld } from './campaign-fixtures';
import { requestEvent } from './request-event';
import { tempDb } from './temp-db';

const HOUR_MS = 3600_000;
const DAY_MS = 24 * HOUR_MS;

function issue(
	db: Db,
	owner: SessionUser,
	scopes: ApiTokenScope[] = ['readings:write'],
	expiresAt: Date | null = null,
	now = Date.now()
) {
	const created = createApiToken(db, owner, { name: 'Acquisition PC', scopes, expiresAt }, now);
	if (!created.ok) throw new Error(created.message);
	return created;
}

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

describe('personal API tokens', () => {
	it('work once created, and the database holds only their SHA-256', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = issue(db, w.aeroA, ['readings:write', 'campaigns:read']);
		expect(created.token).toMatch(/^twt_[A-Za-z0-9_-]{43}$/);

		const found = authenticateApiToken(db, created.token);
		expect(found?.user.id).toBe(w.aeroA.id);
		expect(found?.user.roles).toEqual(['aerodynamicist']);
		expect(found?.tokenId).toBe(created.id);
		expect(found?.scopes).toEqual(['readings:write', 'campaigns:read']);

		const stored = db.select().from(apiToken).where(eq(apiToken.id, created.id)).get()!;
		expect(stored.tokenHash).toBe(sha256(created.token));
		expect(JSON.stringify(stored)).not.toContain(created.token);
		expect(authenticateApiToken(db, stored.tokenHash)).toBeNull();
		expect(authenticateApiToken(db, `${created.token}x`)).toBeNull();
	});

	it('list only the viewer’s own tokens, without hash or secret', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const mine = issue(db, w.aeroA);
		issue(db, w.aeroB);
		const listed = listApiTokens(db, w.aeroA);
		expect(listed.map((t) => t.id)).toEqual([mine.id]);
		expect(Object.keys(listed[0]!).sort()).toEqual([
			'createdAt',
			'expiresAt',
			'id',
			'lastUsedAt',
			'name',
			'revokedAt',
			'scopes',
			'state'
		]);
		expect(JSON.stringify(listed)).not.toContain(mine.token);
		expect(JSON.stringify(listed)).not.toContain(sha256(mine.token));
		expect(listed[0]!.state).toBe('active');
	});

	it('stop working once revoked; revoking again keeps the first moment', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = issue(db, w.aeroA);
		const now = Date.now();
		expect(revokeApiToken(db, w.aeroA, created.id, now).ok).toBe(true);
		expect(authenticateApiToken(db, created.token)).toBeNull();
		expect(revokeApiToken(db, w.aeroA, created.id, now + HOUR_MS).ok).toBe(true);
		const [listed] = listApiTokens(db, w.aeroA);
		expect(listed!.revokedAt?.getTime()).toBe(now);
		expect(listed!.state).toBe('revoked');
	});

	it('stop working at their expiry', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const now = Date.now();
		const created = issue(db, w.aeroA, ['readings:write'], new Date(now + HOUR_MS), now);
		expect(authenticateApiToken(db, created.token, now + HOUR_MS - 1)).not.toBeNull();
		expect(authenticateApiToken(db, created.token, now + HOUR_MS)).toBeNull();
		expect(listApiTokens(db, w.aeroA, now + HOUR_MS)[0]!.state).toBe('expired');
	});

	it('stop working while the owner is deactivated, and carry the owner’s current roles', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = issue(db, w.aeroA);
		db.insert(userRole).values({ userId: w.aeroA.id, role: 'reviewer' }).run();
		expect(authenticateApiToken(db, created.token)?.user.roles.sort()).toEqual([
			'aerodynamicist',
			'reviewer'
		]);
		db.update(user).set({ active: false }).where(eq(user.id, w.aeroA.id)).run();
		expect(authenticateApiToken(db, created.token)).toBeNull();
	});

	it('cannot be revoked by another user, who is told there is no such token', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = issue(db, w.aeroA);
		expect(revokeApiToken(db, w.aeroB, created.id)).toMatchObject({ ok: false, code: 'not-found' });
		expect(revokeApiToken(db, w.aeroA, 'no-such-token')).toMatchObject({ code: 'not-found' });
		expect(authenticateApiToken(db, created.token)).not.toBeNull();
	});

	it('record when they were last used, at most once a minute', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const now = Date.now();
		const created = issue(db, w.aeroA, ['readings:write'], null, now);
		const lastUsed = () => listApiTokens(db, w.aeroA)[0]!.lastUsedAt?.getTime();
		expect(lastUsed()).toBeUndefined();
		authenticateApiToken(db, created.token, now + 1000);
		expect(lastUsed()).toBe(now + 1000);
		authenticateApiToken(db, created.token, now + 30_000);
		expect(lastUsed()).toBe(now + 1000);
		authenticateApiToken(db, created.token, now + 61_000);
		expect(lastUsed()).toBe(now + 61_000);
	});

	it('refuse an expiry in the past or beyond the longest lifetime, and store nothing', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const now = Date.now();
		const input = { name: 'Old', scopes: ['readings:read' as const] };
		expect(
			createApiToken(db, w.aeroA, { ...input, expiresAt: new Date(now - 1) }, now)
		).toMatchObject({ ok: false, code: 'invalid', field: 'expiresAt' });
		expect(
			createApiToken(db, w.aeroA, { ...input, expiresAt: new Date(now + 367 * DAY_MS) }, now)
		).toMatchObject({ ok: false, code: 'invalid', field: 'expiresAt' });
		expect(listApiTokens(db, w.aeroA)).toEqual([]);
		expect(
			createApiToken(db, w.aeroA, { ...input, expiresAt: new Date(now + 366 * DAY_MS) }, now).ok
		).toBe(true);
	});
});

describe('tokenScopeFor', () => {
	it('takes tokens only on the campaign reads and readings, never on token management', () => {
		expect(tokenScopeFor('POST', '/api/v1/campaigns/[id]/readings')).toBe('readings:write');
		expect(tokenScopeFor('GET', '/api/v1/campaigns/[id]/readings')).toBe('readings:read');
		for (const route of [
			'/api/v1/campaigns',
			'/api/v1/campaigns/[id]',
			'/api/v1/campaigns/[id]/matrix',
			'/api/v1/campaigns/[id]/revisions',
			'/api/v1/campaigns/[id]/revisions/[n]'
		]) {
			expect(tokenScopeFor('GET', route)).toBe('campaigns:read');
		}
		expect(tokenScopeFor('POST', '/api/v1/campaigns')).toBeNull();
		expect(tokenScopeFor('DELETE', '/api/v1/campaigns/[id]')).toBeNull();
		expect(tokenScopeFor('GET', '/api/v1/tokens')).toBeNull();
		expect(tokenScopeFor('POST', '/api/v1/tokens')).toBeNull();
		expect(tokenScopeFor('GET', '/(app)/account')).toBeNull();
		expect(tokenScopeFor('GET', null)).toBeNull();
	});
});

type Resolve = (event: RequestEvent) => Response | Promise<Response>;

/** Runs the bearer handle on a request as hooks would, with `resolve` standing for the route. */
async function throughBearer(
	db: Db,
	init: {
		method?: string;
		path: string;
		routeId: string | null;
		authorization?: string;
		params?: Record<string, string>;
	},
	resolve: Resolve = () => new Response('resolved')
) {
	const event = requestEvent({
		db,
		method: init.method,
		path: init.path,
		routeId: init.routeId,
		params: init.params,
		headers: init.authorization ? { authorization: init.authorization } : {}
	});
	const { locals } = event;
	let resolved = false;
	let response: Response;
	try {
		response = await authenticateBearer({
			event,
			resolve: async (e) => {
				resolved = true;
				return resolve(e);
			}
		});
	} catch (thrown) {
		if (!isHttpError(thrown)) throw thrown;
		response = Response.json(thrown.body, { status: thrown.status });
	}
	const body = response.headers.get('content-type')?.includes('json')
		? await response.json()
		: await response.text();
	return { status: response.status, body, headers: response.headers, resolved, locals };
}

describe('the bearer handle', () => {
	const READINGS = {
		path: '/api/v1/campaigns/c1/readings',
		routeId: '/api/v1/campaigns/[id]/readings'
	};

	it('lets requests without a token through untouched', async () => {
		const db = tempDb();
		const result = await throughBearer(db, READINGS);
		expect(result.resolved).toBe(true);
		expect(result.locals.user).toBeNull();
		expect(result.locals.apiToken).toBeNull();
	});

	it('answers 401 with a Bearer challenge for an unknown, revoked or misplaced token', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = issue(db, w.aeroA, ['readings:write']);
		const revoked = issue(db, w.aeroA, ['readings:write']);
		revokeApiToken(db, w.aeroA, revoked.id);
		for (const authorization of [
			'Bearer twt_not-a-token',
			'Bearer ',
			`Bearer ${revoked.token}`,
			`Bearer ${created.token} extra`
		]) {
			const result = await throughBearer(db, { ...READINGS, method: 'POST', authorization });
			expect(result.status).toBe(401);
			expect(result.body.error.code).toBe('invalid-token');
			expect(result.headers.get('www-authenticate')).toMatch(/^Bearer /);
			expect(result.resolved).toBe(false);
		}
		const onPage = await throughBearer(db, {
			path: '/campaigns',
			routeId: '/(app)/campaigns',
			authorization: `Bearer ${created.token}`
		});
		expect(onPage.status).toBe(401);
		expect(onPage.resolved).toBe(false);
	});

	it('answers 403 naming the scope a token lacks, and on routes that take no tokens', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const reader = issue(db, w.aeroA, ['readings:read']);
		const lacking = await throughBearer(db, {
			...READINGS,
			method: 'POST',
			authorization: `Bearer ${reader.token}`
		});
		expect(lacking.status).toBe(403);
		expect(lacking.body.error.code).toBe('insufficient-scope');
		expect(lacking.body.error.message).toContain('readings:write');
		expect(lacking.headers.get('www-authenticate')).toContain('scope="readings:write"');
		expect(lacking.resolved).toBe(false);

		const everything = issue(db, w.aeroA, ['readings:write', 'readings:read', 'campaigns:read']);
		for (const method of ['GET', 'POST']) {
			const minting = await throughBearer(db, {
				method,
				path: '/api/v1/tokens',
				routeId: '/api/v1/tokens',
				authorization: `Bearer ${everything.token}`
			});
			expect(minting.status).toBe(403);
			expect(minting.body.error.code).toBe('token-not-accepted');
			expect(minting.resolved).toBe(false);
		}
	});

	it('signs the request in as the owner for a route within the token’s scope', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const writer = issue(db, w.aeroA, ['readings:write']);
		const result = await throughBearer(db, {
			...READINGS,
			method: 'POST',
			authorization: `bearer ${writer.token}`
		});
		expect(result.status).toBe(200);
		expect(result.resolved).toBe(true);
		expect(result.locals.user?.id).toBe(w.aeroA.id);
		expect(result.locals.apiToken).toEqual({ id: writer.id, scopes: ['readings:write'] });
	});

	it('leaves the route’s own team checks in force', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const campaign = createCampaign(db, w.aeroA, w.input());
		if (!campaign.ok) throw new Error(campaign.message);
		const route = {
			path: `/api/v1/campaigns/${campaign.id}`,
			routeId: '/api/v1/campaigns/[id]',
			params: { id: campaign.id }
		};
		const read = (e: RequestEvent) =>
			campaignItem.GET(e as Parameters<typeof campaignItem.GET>[0]) as Promise<Response>;
		const own = issue(db, w.aeroA2, ['campaigns:read']);
		const other = issue(db, w.aeroB, ['campaigns:read']);
		const mine = await throughBearer(db, { ...route, authorization: `Bearer ${own.token}` }, read);
		expect(mine.status).toBe(200);
		expect(mine.body.id).toBe(campaign.id);
		const theirs = await throughBearer(
			db,
			{ ...route, authorization: `Bearer ${other.token}` },
			read
		);
		expect(theirs.status).toBe(404);
	});
});

describe('the token API', () => {
	it('creates, lists and revokes the caller’s own tokens', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const expiresAt = new Date(Date.now() + 30 * DAY_MS).toISOString();
		const created = await call(tokens.POST, db, w.reviewer, {
			body: { name: '  Hall PC  ', scopes: ['readings:read', 'readings:read'], expiresAt }
		});
		expect(created.status).toBe(201);
		expect(created.body).toMatchObject({ name: 'Hall PC', scopes: ['readings:read'], expiresAt });
		expect(authenticateApiToken(db, created.body.token)?.user.id).toBe(w.reviewer.id);

		const listed = await call(tokens.GET, db, w.reviewer);
		expect(listed.status).toBe(200);
		expect(listed.body.tokens).toHaveLength(1);
		expect(listed.body.tokens[0]).toMatchObject({ id: created.body.id, state: 'active' });
		expect(JSON.stringify(listed.body)).not.toContain(created.body.token);
		expect((await call(tokens.GET, db, w.aeroA)).body.tokens).toEqual([]);

		const params = { id: created.body.id };
		expect((await call(tokenItem.DELETE, db, w.aeroA, { method: 'DELETE', params })).status).toBe(
			404
		);
		expect(
			(await call(tokenItem.DELETE, db, w.reviewer, { method: 'DELETE', params })).status
		).toBe(204);
		expect(
			(await call(tokenItem.DELETE, db, w.reviewer, { method: 'DELETE', params })).status
		).toBe(204);
		expect(authenticateApiToken(db, created.body.token)).toBeNull();
		expect((await call(tokens.GET, db, w.reviewer)).body.tokens[0].state).toBe('revoked');
	});

	it('answers 400 with field messages for bad input, and 401 signed out', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const empty = await call(tokens.POST, db, w.aeroA, { body: { name: '', scopes: [] } });
		expect(empty.status).toBe(400);
		expect(Object.keys(empty.body.error.fields).sort()).toEqual(['name', 'scopes']);
		const unknownScope = await call(tokens.POST, db, w.aeroA, {
			body: { name: 'PC', scopes: ['admin'] }
		});
		expect(unknownScope.status).toBe(400);
		const past = await call(tokens.POST, db, w.aeroA, {
			body: { name: 'PC', scopes: ['readings:write'], expiresAt: '2000-01-01' }
		});
		expect(past.status).toBe(400);
		expect(past.body.error.fields).toHaveProperty('expiresAt');
		expect((await call(tokens.GET, db, w.aeroA)).body.tokens).toEqual([]);

		expect((await call(tokens.GET, db, null)).status).toBe(401);
		expect((await call(tokens.POST, db, null, { body: { name: 'PC' } })).status).toBe(401);
		expect(
			(await call(tokenItem.DELETE, db, null, { method: 'DELETE', params: { id: 'x' } })).status
		).toBe(401);
	});
});
