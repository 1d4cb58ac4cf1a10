import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import * as readings from '../../src/routes/api/v1/campaigns/[id]/readings/+server';
import { callRoute as call } from './call-route';
import { approvedCampaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';
import { tempStore } from './temp-store';

const ORIGIN = 'http://localhost';
const CSV =
	'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit\n' +
	'1,static,-2.0,mmH2O,57.89,Pa,20,1013.25,hPa\n' +
	'2,static,-1.5,mmH2O,57.89,Pa,20,1013.25,hPa\n';

function world() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const params = { id: w.campaignId };
	const post = (user: SessionUser, body: BodyInit, headers: Record<string, string>, search = '') =>
		call(readings.POST, db, user, { raw: body, headers, params, search, files: tempStore() });
	return { db, w, params, post };
}

describe('POST /api/v1/campaigns/:id/readings', () => {
	it('stores a CSV and answers the upload and the coverage', async () => {
		const { w, post } = world();
		const answer = await post(w.aeroA, CSV, { 'content-type': 'text/csv' });
		expect(answer.status).toBe(201);
		expect(answer.body.upload).toMatchObject({ readingCount: 2, runCount: 1, replacedCount: 0 });
		expect(answer.body.upload.sha256).toMatch(/^[0-9a-f]{64}$/);
		expect(answer.body.coverage).toMatchObject({ plannedPoints: 180, pointsWithReadings: 2 });
	});

	it('answers 400 with the problems, 409 naming the points, and 415 for another type', async () => {
		const { w, post } = world();
		const bad = await post(w.aeroA, CSV.replace('-1.5', 'n/a'), { 'content-type': 'text/csv' });
		expect(bad.status).toBe(400);
		expect(bad.body.error).toMatchObject({ code: 'invalid-readings', problemCount: 1 });
		expect(bad.body.error.problems[0]).toMatchObject({ row: 3, column: 'reading' });

		expect((await post(w.aeroA, CSV, { 'content-type': 'text/csv' })).status).toBe(201);
		const again = await post(w.aeroA, CSV, { 'content-type': 'text/csv' });
		expect(again.status).toBe(409);
		expect(again.body.error).toMatchObject({ code: 'conflict', points: [1, 2], pointCount: 2 });
		const replaced = await post(w.aeroA, CSV, { 'content-type': 'text/csv' }, '?replace=true');
		expect(replaced.status).toBe(201);
		expect(replaced.body.upload.replacedCount).toBe(2);

		const xml = await post(w.aeroA, '<readings/>', { 'content-type': 'application/xml' });
		expect(xml.status).toBe(415);
	});

	it('refuses a body over the limit before reading it whole', async () => {
		const { w, post } = world();
		const big = await post(w.aeroA, 'x', {
			'content-type': 'text/csv',
			'content-length': String(25 * 1024 * 1024)
		});
		expect(big.status).toBe(413);
	});

	it('streams progress lines and ends with the result when asked', async () => {
		const { w, post } = world();
		const answer = await post(w.aeroA, CSV, {
			'content-type': 'text/csv',
			accept: 'application/x-ndjson'
		});
		expect(answer.status).toBe(200);
		const lines = answer.body as { type: string; phase?: string; status?: number }[];
		expect(lines.map((l) => l.phase ?? l.type)).toEqual(
			expect.arrayContaining(['parse', 'check', 'store', 'result'])
		);
		expect(lines.at(-1)).toMatchObject({ type: 'result', status: 201 });
	});

	it('keeps other teams out and reviewers from writing', async () => {
		const { w, post } = world();
		expect((await post(w.aeroB, CSV, { 'content-type': 'text/csv' })).status).toBe(404);
		expect((await post(w.reviewer, CSV, { 'content-type': 'text/csv' })).status).toBe(403);
	});
});

describe('GET /api/v1/campaigns/:id/readings', () => {
	it('pages the current readings with their run conditions and coverage', async () => {
		const { db, w, params, post } = world();
		await post(w.aeroA, CSV, { 'content-type': 'text/csv' });
		const page = await call(readings.GET, db, w.reviewer, { params, search: '?limit=1' });
		expect(page.status).toBe(200);
		expect(page.body).toMatchObject({ revision: 1, readingCount: 2, offset: 0, limit: 1 });
		expect(page.body.readings).toHaveLength(1);
		// NIST SP 811 (2008) Appendix B.8: 1 conventional mmH2O = 9.806 65 Pa.
		expect(page.body.readings[0].pressure_Pa).toBeCloseTo(-2 * 9.80665, 10);
		expect(page.body.conditions[0]).toMatchObject({ run: 1, referenceDynamicPressure_Pa: 57.89 });
		expect(page.body.coverage.runs.partial).toBe(1);

		expect((await call(readings.GET, db, w.aeroB, { params })).status).toBe(404);
		expect((await call(readings.GET, db, w.aeroA, { params, search: '?limit=0' })).status).toBe(
			400
		);
	});
});
