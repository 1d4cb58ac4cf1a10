import { describe, expect, it } from 'vitest';
import { DEMO_FACILITIES } from '../../scripts/demo-scenario';
import { campaignSchema } from '../../src/lib/schemas/campaign';
import * as campaignItem from '../../src/routes/api/v1/campaigns/[id]/+server';
import * as campaignMatrix from '../../src/routes/api/v1/campaigns/[id]/matrix/+server';
import * as campaigns from '../../src/routes/api/v1/campaigns/+server';
import * as facilities from '../../src/routes/api/v1/facilities/+server';
import * as models from '../../src/routes/api/v1/models/+server';
import { callRoute as call } from './call-route';
import { campaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';

describe('the resource API enforces roles and teams', () => {
	it('creates and reads campaigns only within the team', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = await call(campaigns.POST, db, w.aeroA, { body: w.input() });
		expect(created.status).toBe(201);
		const params = { id: created.body.id as string };

		expect((await call(campaignItem.GET, db, w.aeroA2, { params })).status).toBe(200);
		expect((await call(campaignItem.GET, db, w.aeroB, { params })).status).toBe(404);
		expect((await call(campaignItem.GET, db, null, { params })).status).toBe(401);
		expect((await call(campaignItem.PUT, db, w.aeroB, { params, body: w.input() })).status).toBe(
			404
		);
		expect((await call(campaignItem.PUT, db, w.aeroA2, { params, body: w.input() })).status).toBe(
			403
		);
		expect((await call(campaignItem.DELETE, db, w.reviewer, { params })).status).toBe(403);
		expect((await call(campaigns.POST, db, w.reviewer, { body: w.input() })).status).toBe(403);
		expect((await call(campaigns.GET, db, w.aeroB)).body.campaigns).toEqual([]);

		const page = await call(campaignMatrix.GET, db, w.aeroA, {
			params,
			search: '?offset=20&limit=10'
		});
		expect(page.status).toBe(200);
		expect(page.body.rowCount).toBe(180);
		expect(page.body.rows.map((r: { point: number }) => r.point)).toEqual([
			21, 22, 23, 24, 25, 26, 27, 28, 29, 30
		]);
		expect(
			(await call(campaignMatrix.GET, db, w.aeroA, { params, search: '?limit=0' })).status
		).toBe(400);
		expect((await call(campaignMatrix.GET, db, w.aeroB, { params })).status).toBe(404);

		expect((await call(campaignItem.DELETE, db, w.aeroA, { params })).status).toBe(204);
		expect((await call(campaignItem.GET, db, w.aeroA, { params })).status).toBe(404);
	});

	it('answers GET in the shape PUT takes: read, change one field, write back', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = await call(campaigns.POST, db, w.aeroA, { body: w.input() });
		const params = { id: created.body.id as string };
		const read = await call(campaignItem.GET, db, w.aeroA, { params });
		expect(read.status).toBe(200);
		expect(campaignSchema.parse(read.body)).toEqual(campaignSchema.parse(w.input()));
		// Everything else is read-only and named outside the schema, so PUT's parse drops it.
		expect(Object.keys(read.body).filter((k) => !(k in campaignSchema.shape))).toEqual([
			'id',
			'state',
			'teamId',
			'ownerId',
			'ownerName',
			'modelName',
			'facilityName',
			'lastRevision',
			'approvedRevisionId',
			'version',
			'createdAt',
			'updatedAt'
		]);

		const changed = { ...read.body, repeats: read.body.repeats + 1 };
		const written = await call(campaignItem.PUT, db, w.aeroA, {
			method: 'PUT',
			params,
			headers: { 'if-match': read.headers.get('etag')! },
			body: { ...changed, id: 'someone-else', state: 'approved', lastRevision: 7, version: 9 }
		});
		expect(written.status).toBe(200);
		const after = await call(campaignItem.GET, db, w.aeroA, { params });
		expect(after.headers.get('etag')).toBe('"2"');
		expect({ ...after.body, updatedAt: changed.updatedAt }).toEqual({ ...changed, version: 2 });
	});

	it('answers 400 with field messages and writes nothing on bad input', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const bad = await call(campaigns.POST, db, w.aeroA, {
			body: { ...w.input(), speeds_mps: [30, 30], repeats: 0 }
		});
		expect(bad.status).toBe(400);
		expect(Object.keys(bad.body.error.fields).sort()).toEqual(['repeats', 'speeds_mps']);
		const outside = await call(campaigns.POST, db, w.aeroA, {
			body: { ...w.input(), speeds_mps: [90] }
		});
		expect(outside.status).toBe(400);
		expect(outside.body.error.fields.speeds_mps[0]).toMatch(
			/90 m\/s is above the facility's maximum/
		);
		expect((await call(campaigns.GET, db, w.admin)).body.campaigns).toEqual([]);
	});

	it('lets only operators and admins add facilities, and aerodynamicists add models to their team', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const tunnel = { ...DEMO_FACILITIES[1]!, name: 'Second tunnel', cornerFillet_m: 0 };
		expect((await call(facilities.POST, db, w.aeroA, { body: tunnel })).status).toBe(403);
		expect((await call(facilities.POST, db, w.admin, { body: tunnel })).status).toBe(201);
		expect((await call(facilities.POST, db, w.admin, { body: tunnel })).status).toBe(409);
		expect(
			(
				await call(facilities.POST, db, w.admin, {
					body: { ...tunnel, name: 'Third', minSpeed_mps: 50, maxSpeed_mps: 10 }
				})
			).body.error.fields
		).toHaveProperty('maxSpeed_mps');

		const model = {
			teamId: w.clientB,
			name: 'Probe body',
			kind: 'other',
			scaleDenominator: 2,
			fullScaleLength_m: 1,
			fullScaleWidth_m: 0.5,
			fullScaleHeight_m: 0.5,
			fullScaleFrontalArea_m2: 0.2,
			referenceLength_m: 1,
			dragCoefficient: null,
			modelVolume_m3: null
		};
		expect((await call(models.POST, db, w.aeroA, { body: model })).status).toBe(403);
		expect((await call(models.POST, db, w.aeroB, { body: model })).status).toBe(201);
		expect(
			(await call(models.POST, db, w.aeroB, { body: { ...model, scaleDenominator: 0 } })).status
		).toBe(400);
		expect(
			(await call(models.GET, db, w.aeroA)).body.models.map((m: { name: string }) => m.name)
		).not.toContain('Probe body');
	});
});
