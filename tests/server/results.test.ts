import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import { receiveReadings } from '../../src/lib/server/readings';
import { campaignResults } from '../../src/lib/server/results';
import { resultsCsv } from '../../src/lib/server/results-export';
import * as resultsRoute from '../../src/routes/api/v1/campaigns/[id]/results/+server';
import { callRoute } from './call-route';
import { approvedCampaign, campaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';
import { tempStore } from './temp-store';

const ORIGIN = 'http://localhost';
const Q = 57.89;
const HEADER =
	'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit,relative_humidity';
const AIR = `${Q},Pa,20,1013.25,hPa,0.5`;

/**
 * The demo's AM-3 sweep with a second configuration: runs 1–9 are the baseline at 15…55 m/s,
 * runs 10–18 the variant; each traverses one 4 × 5 plane (y 0.03–0.18 m, z −0.12–0.12 m).
 */
function world() {
	const db = tempDb();
	const w = campaignWorld(db);
	const input = w.input();
	const campaignId = approvedCampaign(
		db,
		w,
		{
			...input,
			configurations: [
				input.configurations[0]!,
				{ id: 'dam', label: 'Front dam', description: 'Air dam fitted.', baseline: false }
			]
		},
		ORIGIN
	);
	const store = tempStore();
	const send = async (lines: string[]) => {
		const outcome = await receiveReadings(db, store, w.aeroA, campaignId, {
			fileName: 'r.csv',
			mediaType: 'text/csv',
			bytes: new TextEncoder().encode([HEADER, ...lines].join('\n')),
			channel: 'api'
		});
		if (!outcome.ok) throw new Error(JSON.stringify(outcome));
	};
	return { db, w, campaignId, send };
}

/** Static gauge readings in Pa for the 20 points of a run, row by row. */
const staticRun = (run: number, pascals: number[]) =>
	pascals.map((p, i) => `${(run - 1) * 20 + i + 1},static,${p},Pa,${AIR}`);

const baselinePascals = Array.from({ length: 20 }, (_, i) => -5 - 0.5 * i);

describe('reducing readings to pressure coefficients', () => {
	it('gives Cp, plane, row and column averages of a run', async () => {
		const { db, w, campaignId, send } = world();
		await send(staticRun(1, baselinePascals));
		const reduced = campaignResults(db, w.aeroA, campaignId);
		expect(reduced.ok).toBe(true);
		if (!reduced.ok) return;
		const run = reduced.results.runs.find((r) => r.run === 1)!;
		// Cp = (p − p∞)/q∞ (Barlow, Rae & Pope, Low-Speed Wind Tunnel Testing, 3rd ed., ch. 2).
		expect(run.points[0]![0]!.cp).toBeCloseTo(-5 / Q, 12);
		// Means computed here by plain loops over the readings, skipping nothing (all present).
		const cp = baselinePascals.map((p) => p / Q);
		const mean = (xs: number[]) => xs.reduce((s, x) => s + x, 0) / xs.length;
		expect(run.averageCp).toBeCloseTo(mean(cp), 12);
		for (let i = 0; i < 4; i++)
			expect(run.rowAverageCp[i]).toBeCloseTo(mean(cp.slice(i * 5, i * 5 + 5)), 12);
		for (let j = 0; j < 5; j++)
			expect(run.columnAverageCp[j]).toBeCloseTo(mean(cp.filter((_, k) => k % 5 === j)), 12);
		expect(run.count).toBe(20);
	});

	it('skips points without readings and leaves empty rows empty', async () => {
		const { db, w, campaignId, send } = world();
		// Row 2 (points 6–10) has no readings.
		await send(staticRun(1, baselinePascals).filter((_, i) => i < 5 || i >= 10));
		const reduced = campaignResults(db, w.aeroA, campaignId);
		if (!reduced.ok) throw new Error(reduced.message);
		const run = reduced.results.runs[0]!;
		expect(run.rowAverageCp[1]).toBeNull();
		expect(run.count).toBe(15);
		expect(run.points[1]![0]!.cp).toBeNull();
	});

	it('differences variant and baseline point by point, with the shared reference correlated', async () => {
		const { db, w, campaignId, send } = world();
		const delta = -0.05;
		await send([
			...staticRun(1, baselinePascals),
			...staticRun(
				10,
				baselinePascals.map((p) => p + delta * Q)
			)
		]);
		const reduced = campaignResults(db, w.aeroA, campaignId, { baseline: 'base' });
		if (!reduced.ok) throw new Error(reduced.message);
		const variant = reduced.results.runs.find((r) => r.run === 10)!;
		expect(variant.difference!.baselineRun).toBe(1);
		expect(variant.difference!.average).toBeCloseTo(delta, 10);
		expect(variant.difference!.points[3]![4]).toBeCloseTo(delta, 10);
		// JCGM 100:2008 eq. 13 with r(q_v, q_b) = 1: for equal q the reference terms leave only
		// (Cp_v − Cp_b)·u_q/q, and the two mean readings add in quadrature, u_p·√2/√n each over q.
		const { readingUncertainty_Pa: uP, referenceQUncertainty: uQ } =
			reduced.results.instrumentUncertainties;
		const expected = Math.hypot((uP * Math.SQRT2) / Math.sqrt(20) / Q, delta * uQ);
		expect(variant.difference!.uncertainty.average).toBeCloseTo(expected, 8);
		expect(reduced.results.runs.find((r) => r.run === 1)!.difference).toBeNull();
	});

	it('measures each run’s speed from its own air and reference q', async () => {
		const { db, w, campaignId, send } = world();
		await send(staticRun(1, baselinePascals));
		const reduced = campaignResults(db, w.aeroA, campaignId);
		if (!reduced.ok) throw new Error(reduced.message);
		const c = reduced.results.runs[0]!.conditions!;
		// ASHRAE Handbook—Fundamentals (2017) ch. 1 moist-air density through psychrolib, an
		// independent library; CIPM-2007 agrees with it to well under 0.1 % at room conditions.
		psychrolib.SetUnitSystem(psychrolib.SI);
		const humidityRatio = psychrolib.GetHumRatioFromRelHum(20, 0.5, 101325);
		const rho = psychrolib.GetMoistAirDensity(20, humidityRatio, 101325);
		expect(c.density_kgm3 / rho - 1).toBeLessThan(1e-3);
		// Pitot-static relation V = √(2q/ρ) for M ≤ 0.3 (Barlow, Rae & Pope, ch. 4).
		expect(c.measuredSpeed_mps / Math.sqrt((2 * Q) / rho) - 1).toBeLessThan(1e-3);
		expect(c.plannedSpeed_mps).toBe(15);
		expect(c.uncertainty.measuredSpeed_mps).toBeGreaterThan(0);
	});

	it('integrates a uniform wake to the momentum-deficit drag', async () => {
		const { db, w, campaignId, send } = world();
		// Uniform u/U = 0.95 and Cp = 0: Cp0 = 0.9025, so the total reading is 0.9025 q.
		const lines = Array.from({ length: 20 }, (_, i) => [
			`${i + 1},static,0,Pa,${AIR}`,
			`${i + 1},total,${0.9025 * Q},Pa,${AIR}`
		]).flat();
		await send(lines);
		const reduced = campaignResults(db, w.aeroA, campaignId);
		if (!reduced.ok) throw new Error(reduced.message);
		const wake = reduced.results.runs[0]!.wake!;
		// Momentum balance (Anderson, Fundamentals of Aerodynamics, §2.6): C_D = 2(u/U)(1 − u/U)·A/S
		// for a uniform deficit; the plane spans 0.15 m × 0.24 m.
		expect(wake.integratedArea_m2).toBeCloseTo(0.15 * 0.24, 12);
		expect(wake.dragCoefficient).toBeCloseTo(
			(2 * 0.95 * 0.05 * wake.integratedArea_m2) / wake.referenceArea_m2,
			9
		);
		expect(wake.notes.map((n) => n.code)).toContain('wake-at-edge');
	});

	it('exports a CSV row for every point and every average', async () => {
		const { db, w, campaignId, send } = world();
		await send(staticRun(1, baselinePascals));
		const reduced = campaignResults(db, w.aeroA, campaignId);
		if (!reduced.ok) throw new Error(reduced.message);
		const lines = resultsCsv(reduced.results).trim().split('\n');
		const levels = lines.slice(1).map((l) => l.split(',')[0]);
		expect(levels.filter((l) => l === 'point')).toHaveLength(20);
		expect(levels.filter((l) => l === 'row')).toHaveLength(4);
		expect(levels.filter((l) => l === 'column')).toHaveLength(5);
		expect(levels.filter((l) => l === 'plane')).toHaveLength(1);
		expect(lines[0]).toContain('measured_speed_mps');
	});
});

describe('GET /api/v1/campaigns/:id/results', () => {
	it('answers the campaign’s team and reviewers, not other teams, and checks the baseline', async () => {
		const { db, w, campaignId, send } = world();
		await send(staticRun(1, baselinePascals));
		const params = { id: campaignId };
		const answer = await callRoute(resultsRoute.GET, db, w.reviewer, { params });
		expect(answer.status).toBe(200);
		expect(answer.body.runs[0]).toMatchObject({ run: 1, configurationId: 'base', count: 20 });
		expect((await callRoute(resultsRoute.GET, db, w.aeroB, { params })).status).toBe(404);
		const unknown = await callRoute(resultsRoute.GET, db, w.aeroA, {
			params,
			search: '?baseline=nope'
		});
		expect(unknown.status).toBe(400);
		expect(
			(await callRoute(resultsRoute.GET, db, w.aeroA, { params, search: '?tolerance=-1' })).status
		).toBe(400);
	});
});
