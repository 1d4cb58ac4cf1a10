import { isActionFailure, isRedirect } from '@sveltejs/kit';
import { stringify } from 'devalue';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import { user } from '../../src/lib/server/db/schema';
import { fieldLabel } from '../../src/lib/server/versions';
import type { StaleDetail } from '../../src/lib/versions';
import * as campaignEdit from '../../src/routes/(app)/campaigns/[id]/edit/+page.server';
import * as campaignItem from '../../src/routes/api/v1/campaigns/[id]/+server';
import * as campaigns from '../../src/routes/api/v1/campaigns/+server';
import * as modelItem from '../../src/routes/api/v1/models/[id]/+server';
import { callRoute as call } from './call-route';
import { campaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';

const nameOf = (db: Db, person: SessionUser) =>
	db.select({ name: user.name }).from(user).where(eq(user.id, person.id)).get()!.name;

function draft() {
	const db = tempDb();
	const w = campaignWorld(db);
	return { db, w };
}

async function created(db: Db, w: ReturnType<typeof campaignWorld>) {
	const made = await call(campaigns.POST, db, w.aeroA, { body: w.input() });
	return made.body.id as string;
}

const put = (db: Db, user: SessionUser, id: string, body: unknown, ifMatch?: string) =>
	call(campaignItem.PUT, db, user, {
		method: 'PUT',
		params: { id },
		body,
		headers: ifMatch === undefined ? {} : { 'if-match': ifMatch }
	});

describe('a write names the version it read (RFC 9110 §13.1.1 If-Match)', () => {
	it('answers GET with a strong ETag and refuses a PUT without If-Match with 428 (RFC 6585 §3)', async () => {
		const { db, w } = draft();
		const id = await created(db, w);
		const read = await call(campaignItem.GET, db, w.aeroA, { params: { id } });
		expect(read.headers.get('etag')).toBe('"1"');
		const blind = await put(db, w.aeroA, id, read.body);
		expect(blind.status).toBe(428);
		expect(blind.body.error.code).toBe('precondition-required');
		for (const tag of ['W/"1"', '1', '"1", "2"'])
			expect((await put(db, w.aeroA, id, read.body, tag)).status).toBe(400);
		const after = await call(campaignItem.GET, db, w.aeroA, { params: { id } });
		expect(after.headers.get('etag')).toBe('"1"');
	});

	it('lets exactly one of several writers of the same version win; the others get 412 and what changed', async () => {
		const { db, w } = draft();
		const id = await created(db, w);
		const read = await call(campaignItem.GET, db, w.aeroA, { params: { id } });
		const tag = read.headers.get('etag')!;
		const answers = await Promise.all(
			Array.from({ length: 20 }, (_, i) =>
				put(db, w.aeroA, id, { ...read.body, name: `Edit ${i}` }, tag)
			)
		);
		const won = answers.filter((a) => a.status === 200);
		expect(won).toHaveLength(1);
		const lost = answers.filter((a) => a.status === 412);
		expect(lost).toHaveLength(19);
		const stale = lost[0]!.body.error.stale as StaleDetail;
		expect(lost[0]!.headers.get('etag')).toBe('"2"');
		const stored = await call(campaignItem.GET, db, w.aeroA, { params: { id } });
		expect(stale).toMatchObject({ version: 2, changedBy: [nameOf(db, w.aeroA)] });
		expect(stale.changes).toEqual([
			{ field: 'name', label: 'Name', before: read.body.name, after: stored.body.name }
		]);
	});

	it('keeps the loser’s values when they write again naming the newer version, or with *', async () => {
		const { db, w } = draft();
		const id = await created(db, w);
		const read = await call(campaignItem.GET, db, w.aeroA, { params: { id } });
		await put(db, w.aeroA, id, { ...read.body, repeats: 2 }, '"1"');
		const late = await put(db, w.aeroA, id, { ...read.body, repeats: 3 }, '"1"');
		expect(late.status).toBe(412);
		const kept = await put(
			db,
			w.aeroA,
			id,
			{ ...read.body, repeats: 3 },
			late.headers.get('etag')!
		);
		expect(kept.status).toBe(200);
		const forced = await put(db, w.aeroA, id, { ...read.body, repeats: 4 }, '*');
		expect(forced.status).toBe(200);
		expect(forced.headers.get('etag')).toBe('"4"');
	});

	it('names every writer since the version read, for a model two team-mates edit', async () => {
		const { db, w } = draft();
		const params = { id: w.modelA };
		const read = await call(modelItem.GET, db, w.aeroA, { params });
		const model = read.body.model;
		const body = (name: string, extra = {}) => ({ ...model, name, ...extra });
		const write = (user: SessionUser, value: unknown, tag: string) =>
			call(modelItem.PUT, db, user, {
				method: 'PUT',
				params,
				body: value,
				headers: { 'if-match': tag }
			});
		expect((await write(w.aeroA2, body('Second name'), '"1"')).status).toBe(200);
		expect(
			(await write(w.aeroA, body('Third name', { referenceLength_m: 3.9 }), '"2"')).status
		).toBe(200);
		const stale = await write(w.aeroA2, body(model.name, { dragCoefficient: 0.31 }), '"1"');
		expect(stale.status).toBe(412);
		const detail = stale.body.error.stale as StaleDetail;
		expect(detail.changedBy.sort()).toEqual([nameOf(db, w.aeroA), nameOf(db, w.aeroA2)].sort());
		expect(detail.changes.map((c) => c.field).sort()).toEqual(['name', 'referenceLength_m']);
		expect(detail.changes.find((c) => c.field === 'name')).toMatchObject({
			before: model.name,
			after: 'Third name'
		});
	});
});

/** Posts the campaign edit form as the editor does: JSON data plus the version it opened. */
async function postEdit(
	db: Db,
	user: SessionUser,
	id: string,
	data: unknown,
	baseVersion?: number
) {
	const body = new FormData();
	body.set('__superform_json', stringify(data));
	if (baseVersion !== undefined) body.set('baseVersion', String(baseVersion));
	const request = new Request(`${ORIGIN}/campaigns/${id}/edit`, { method: 'POST', body });
	try {
		const result = await campaignEdit.actions.default!({
			request,
			url: new URL(request.url),
			params: { id },
			locals: { db, user, apiToken: null }
		} as never);
		const failed = isActionFailure(result);
		const data = (failed ? result.data : result) as {
			form: { message?: { stale?: StaleDetail }; errors: Record<string, string[] | undefined> };
		};
		return { status: failed ? result.status : 200, form: data.form };
	} catch (thrown) {
		if (isRedirect(thrown)) return { status: thrown.status, form: undefined };
		throw thrown;
	}
}

describe('the edit form carries the version it was opened at', () => {
	it('saves once, then answers a stale save 409 with who changed what, keeping nothing else', async () => {
		const { db, w } = draft();
		const id = await created(db, w);
		const opened = w.input();
		expect((await postEdit(db, w.aeroA, id, { ...opened, name: 'Tab one' }, 1)).status).toBe(303);
		const second = await postEdit(db, w.aeroA, id, { ...opened, repeats: 2 }, 1);
		expect(second.status).toBe(409);
		expect(second.form!.message!.stale!.changes.map((c) => c.label)).toEqual(['Name']);
		const stored = await call(campaignItem.GET, db, w.aeroA, { params: { id } });
		expect(stored.body).toMatchObject({ name: 'Tab one', repeats: opened.repeats, version: 2 });
		const kept = await postEdit(db, w.aeroA, id, { ...opened, repeats: 2 }, 2);
		expect(kept.status).toBe(303);
	});

	it('refuses a post that does not say which version it opened', async () => {
		const { db, w } = draft();
		const id = await created(db, w);
		const blind = await postEdit(db, w.aeroA, id, { ...w.input(), name: 'Blind' });
		expect(blind.status).toBe(400);
		expect(blind.form!.errors._errors?.join(' ')).toMatch(/which version/);
	});
});

describe('a changed field is named in the trade’s words with its unit', () => {
	it.each([
		['sectionWidth_m', 'Section width (m)'],
		['speeds_mps', 'Speeds (m/s)'],
		['yawAngles_deg', 'Yaw angles (°)'],
		['modelId', 'Model'],
		['fullScaleFrontalArea_m2', 'Full scale frontal area (m²)'],
		['repeats', 'Repeats']
	])('%s → %s', (field, label) => expect(fieldLabel(field)).toBe(label));
});
