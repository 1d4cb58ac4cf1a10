/**
 * Two server processes on one database file, written to at once: of writers who read the same
 * version exactly one wins and the others are told (412); a submission freezes exactly the draft
 * that is stored, whichever process an edit arrives at; and nobody gets a 500.
 */
import Database from 'better-sqlite3';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSeededApp, type RunningApp } from '../../scripts/app-server';
import { signInCookie } from './http-session';

let app: RunningApp;
/** The owner's session on each process (one cookie works on both: they share the secret). */
let cookie: string;

beforeAll(async () => {
	app = await startSeededApp({ quiet: true, processes: 2 });
	cookie = await signInCookie(app.baseUrl, 'aero@demo.test');
}, 60_000);

afterAll(() => app?.stop());

type Sent = {
	status: number;
	body: Record<string, unknown>;
	etag: string | null;
	retryAfter: string | null;
};

async function call(
	process: number,
	method: string,
	path: string,
	{ body, ifMatch, cookie: as = cookie }: { body?: unknown; ifMatch?: string; cookie?: string } = {}
): Promise<Sent> {
	const baseUrl = app.baseUrls[process % app.baseUrls.length]!;
	const response = await fetch(new URL(path, baseUrl), {
		method,
		headers: {
			cookie: as,
			origin: baseUrl,
			...(body === undefined ? {} : { 'content-type': 'application/json' }),
			...(ifMatch ? { 'if-match': ifMatch } : {})
		},
		body: body === undefined ? undefined : JSON.stringify(body)
	});
	const text = await response.text();
	return {
		status: response.status,
		body: text ? (JSON.parse(text) as Record<string, unknown>) : {},
		etag: response.headers.get('etag'),
		retryAfter: response.headers.get('retry-after')
	};
}

/** A new draft of the owner's, copied from one of the seeded drafts. */
async function freshDraft(name: string) {
	const listed = await call(0, 'GET', '/api/v1/campaigns');
	const drafts = (listed.body.campaigns as { id: string; state: string }[]).filter(
		(c) => c.state === 'draft'
	);
	const source = await call(0, 'GET', `/api/v1/campaigns/${drafts[0]!.id}`);
	const made = await call(0, 'POST', '/api/v1/campaigns', { body: { ...source.body, name } });
	expect(made.status).toBe(201);
	const read = await call(0, 'GET', `/api/v1/campaigns/${made.body.id}`);
	return { id: made.body.id as string, body: read.body, etag: read.etag! };
}

/**
 * `count` copies of the demo's approved campaign, each with one completed slot waiting for an
 * invoice, written straight into the database: the setup, not what is tested.
 */
function completedCampaignCopies(count: number) {
	const db = new Database(app.databasePath);
	try {
		const source = db
			.prepare(`select * from campaign where state = 'approved' limit 1`)
			.get() as Record<string, unknown>;
		const slot = db
			.prepare(`select * from booking where campaign_id = ? limit 1`)
			.get(source.id) as Record<string, unknown>;
		const insert = (table: string, row: Record<string, unknown>) =>
			db
				.prepare(
					`insert into ${table} (${Object.keys(row).join(', ')}) values (${Object.keys(row)
						.map((k) => `@${k}`)
						.join(', ')})`
				)
				.run(row);
		const ids = Array.from({ length: count }, (_, i) => {
			const id = randomUUID();
			insert('campaign', { ...source, id, name: `Invoiced in parallel ${i}` });
			insert('booking', { ...slot, id: randomUUID(), campaign_id: id, state: 'completed' });
			return id;
		});
		return { ids, facilityId: source.facility_id as string };
	} finally {
		db.close();
	}
}

function highestInvoiceNumber(facilityId: string): number {
	const db = new Database(app.databasePath, { readonly: true });
	try {
		const row = db
			.prepare(`select coalesce(max(number), 0) as n from invoice where facility_id = ?`)
			.get(facilityId) as { n: number };
		return row.n;
	} finally {
		db.close();
	}
}

describe('writes from two processes on one database', () => {
	it('lets one of 20 writers of the same version win and tells the other 19', async () => {
		const draft = await freshDraft('Parallel writers');
		const answers = await Promise.all(
			Array.from({ length: 20 }, (_, i) =>
				call(i, 'PUT', `/api/v1/campaigns/${draft.id}`, {
					body: { ...draft.body, objective: `Writer ${i}` },
					ifMatch: draft.etag
				})
			)
		);
		const statuses = answers.map((a) => a.status).sort();
		expect(statuses.filter((s) => s === 200)).toHaveLength(1);
		expect(statuses.filter((s) => s === 412)).toHaveLength(19);
		const winner = answers.indexOf(answers.find((a) => a.status === 200)!);
		const stored = await call(1, 'GET', `/api/v1/campaigns/${draft.id}`);
		expect(stored.body.objective).toBe(`Writer ${winner}`);
		expect(stored.etag).toBe('"2"');
	});

	it('freezes exactly the stored draft when edits and submissions race on both processes', async () => {
		const drafts = await Promise.all(Array.from({ length: 15 }, (_, i) => freshDraft(`Race ${i}`)));
		const raced = await Promise.all(
			drafts.flatMap((d, i) => [
				call(i, 'PUT', `/api/v1/campaigns/${d.id}`, {
					body: { ...d.body, repeats: (d.body.repeats as number) + 1 },
					ifMatch: d.etag
				}),
				call(i + 1, 'POST', `/api/v1/campaigns/${d.id}/submit`)
			])
		);
		// An edit that lost the race to the submission is refused as no longer a draft (409).
		for (const answer of raced) expect([200, 201, 409]).toContain(answer.status);
		for (const d of drafts) {
			const stored = await call(0, 'GET', `/api/v1/campaigns/${d.id}`);
			expect(stored.body.state).toBe('in-review');
			const frozen = await call(1, 'GET', `/api/v1/campaigns/${d.id}/revisions/1`);
			const snapshot = (frozen.body.revision as { snapshot: { definition: unknown } }).snapshot;
			expect(snapshot.definition).toMatchObject({ repeats: stored.body.repeats });
		}
	});

	it('numbers 20 invoices issued at once on both processes 1 to 20 higher, without gaps or twins', async () => {
		const campaigns = completedCampaignCopies(20);
		const operatorCookie = await signInCookie(app.baseUrl, 'operator@demo.test');
		const before = highestInvoiceNumber(campaigns.facilityId);
		const answers = await Promise.all(
			campaigns.ids.map((campaignId, i) =>
				call(i, 'POST', '/api/v1/invoices', { body: { campaignId }, cookie: operatorCookie })
			)
		);
		expect(answers.map((a) => a.status)).toEqual(answers.map(() => 201));
		const numbers = answers.map((a) => a.body.number as number).sort((a, b) => a - b);
		expect(numbers).toEqual(Array.from({ length: 20 }, (_, i) => before + 1 + i));
	});

	it('answers 503 with Retry-After when another process holds the write lock past the timeout', async () => {
		const draft = await freshDraft('Held lock');
		const holder = new Database(app.databasePath);
		holder.pragma('busy_timeout = 5000');
		holder.exec('BEGIN IMMEDIATE');
		let held: Sent;
		try {
			held = await call(0, 'PUT', `/api/v1/campaigns/${draft.id}`, {
				body: { ...draft.body, objective: 'While locked' },
				ifMatch: draft.etag
			});
		} finally {
			holder.exec('ROLLBACK');
			holder.close();
		}
		expect(held.status).toBe(503);
		expect((held.body.error as { code: string }).code).toBe('busy');
		expect(Number(held.retryAfter)).toBeGreaterThan(0);
		const retried = await call(0, 'PUT', `/api/v1/campaigns/${draft.id}`, {
			body: { ...draft.body, objective: 'After the lock' },
			ifMatch: draft.etag
		});
		expect(retried.status).toBe(200);
	});
});
