import { isHttpError, type RequestEvent } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import { MAX_REQUEST_BODY_BYTES } from '../../src/lib/server/api';
import { POST as atmosphere } from '../../src/routes/api/v1/calc/atmosphere/+server';
import { POST as blockage } from '../../src/routes/api/v1/calc/blockage/+server';
import { POST as matrix } from '../../src/routes/api/v1/calc/matrix/+server';
import { POST as similarity } from '../../src/routes/api/v1/calc/similarity/+server';
import { requestEvent } from './request-event';

const viewer: SessionUser = {
	id: 'u1',
	email: 'u@example.org',
	name: 'U',
	roles: ['reviewer'],
	teams: []
};

function post(
	handler: (e: RequestEvent) => unknown,
	body: unknown,
	user: SessionUser | null = viewer
) {
	const event = requestEvent(
		typeof body === 'string'
			? { user, raw: body, headers: { 'content-type': 'application/json' } }
			: { user, json: body }
	);
	return handler(event) as Promise<Response>;
}

const sea = { model: 'isa', geopotentialAltitude: 0 };

describe('POST /api/v1/calc/*', () => {
	it('needs a signed-in user', async () => {
		const refused = await post(atmosphere, sea, null).catch((e: unknown) => e);
		expect(isHttpError(refused) && refused.status).toBe(401);
	});

	it('answers the ISA in SI with units in the names', async () => {
		const response = await post(atmosphere, {
			model: 'isa',
			geopotentialAltitude: { value: 1, unit: 'km' }
		});
		expect(response.status).toBe(200);
		const { air } = await response.json();
		// ISO 2533:1975 table 5 (from memory): H = 1000 m → 281.650 K, 89 874.6 Pa.
		expect(air.temperature_K).toBeCloseTo(281.65, 3);
		expect(air.pressure_Pa).toBeCloseTo(89874.6, 0);
	});

	it('accepts measured air in °C and mmHg', async () => {
		// Gupta, Mass Metrology, Appendix (CIPM-2007): 10 °C, 730 mmHg, 40 % RH → 1.19569 kg/m³.
		const response = await post(atmosphere, {
			model: 'measured',
			temperature: { value: 10, unit: 'C' },
			pressure: { value: 730, unit: 'mmHg' },
			relativeHumidity: 0.4
		});
		expect((await response.json()).air.density_kgm3).toBeCloseTo(1.19569, 4);
	});

	it('converts speeds given with a unit', async () => {
		// Katz, Automotive Aerodynamics, Example 4.2: 4.0 m at 100 km/h is Re ≈ 7.5e6 at sea level.
		const response = await post(similarity, {
			scale: 1,
			fullScaleLength: 4,
			fullScaleSpeed: { value: 100, unit: 'km/h' },
			modelSpeed: { value: 100, unit: 'km/h' },
			fullScaleAir: sea,
			tunnelAir: sea
		});
		const body = await response.json();
		expect(body.fullScaleRe / 7.5e6).toBeGreaterThan(0.99);
		expect(body.fullScaleRe / 7.5e6).toBeLessThan(1.03);
		expect(body.reRatio).toBeCloseTo(1, 9);
	});

	it('gives field messages for bad input', async () => {
		const response = await post(similarity, {
			scale: 0,
			fullScaleLength: { value: 4, unit: 'parsecs' },
			fullScaleSpeed: 30,
			modelSpeed: 30,
			fullScaleAir: sea,
			tunnelAir: { model: 'isa', geopotentialAltitude: 200000 }
		});
		expect(response.status).toBe(400);
		const { error } = await response.json();
		expect(error.code).toBe('invalid');
		expect(Object.keys(error.fields).sort()).toEqual([
			'fullScaleLength.unit',
			'scale',
			'tunnelAir.geopotentialAltitude'
		]);
		expect(error.fields['tunnelAir.geopotentialAltitude'][0]).toMatch(
			/^geopotentialAltitude = 200000 .*\[-2000, 84852\]/
		);
		// The request's own names only: no unit-suffixed core parameter, no bare `_`.
		expect(JSON.stringify(error)).not.toMatch(/_m\b|_mps|"_"/);
	});

	it('answers 400 for input only the core can refuse, naming the parameter', async () => {
		const response = await post(blockage, {
			frontalArea: 5,
			section: { kind: 'closed', width: 2, height: 1.5 }
		});
		expect(response.status).toBe(400);
		expect((await response.json()).error.fields.frontalArea[0]).toMatch(
			/^frontalArea = 5 is outside .*less than the section area/
		);
	});

	it('refuses a bare temperature that can only be meant as °C, naming the unit', async () => {
		const response = await post(similarity, {
			scale: 0.25,
			fullScaleLength: 4,
			fullScaleSpeed: 30,
			modelSpeed: 30,
			fullScaleAir: sea,
			tunnelAir: { model: 'measured', temperature: 20, pressure: 101325 }
		});
		expect(response.status).toBe(400);
		const { error } = await response.json();
		expect(error.fields['tunnelAir.temperature'][0]).toMatch(/kelvin.*"unit": "C"/);
	});

	it('answers 400 for malformed JSON and 413 for an oversized body', async () => {
		expect((await post(blockage, '{"frontalArea": ')).status).toBe(400);
		const huge = JSON.stringify({ pad: 'x'.repeat(MAX_REQUEST_BODY_BYTES) });
		expect((await post(blockage, huge)).status).toBe(413);
	});

	it('pages the matrix and adds blockage, envelope findings and occupancy', async () => {
		const response = await post(matrix, {
			configurations: [{ id: 'baseline', baseline: true }, { id: 'wing' }],
			speeds: [{ value: 72, unit: 'km/h' }, 30],
			yawAngles_deg: [0, 10],
			planes: [
				{
					id: 'x1',
					downstream: { value: 500, unit: 'mm' },
					grid: { rows: 4, columns: 5, rowSpacing: 0.02, columnSpacing: 0.02 }
				}
			],
			dwellPerPoint: 10,
			repeats: 1,
			modelReferenceLength: 1.1,
			tunnelAir: sea,
			blockage: { frontalArea: 0.12, section: { kind: 'closed', width: 2, height: 1.5 } },
			envelope: {
				minSpeed: 5,
				maxSpeed: 25,
				maxDynamicPressure: 2000,
				yawMin_deg: -5,
				yawMax_deg: 5
			},
			timing: {
				settling: 60,
				traverseMove: 4,
				yawChange: 45,
				modelChange: { value: 30, unit: 'min' },
				setUp: { value: 3, unit: 'h' },
				tearDown: 0
			},
			offset: 10,
			limit: 5
		});
		expect(response.status).toBe(200);
		const body = await response.json();
		expect(body.rowCount).toBe(2 * 2 * 2 * 20);
		expect(body.rows.map((r: { point: number }) => r.point)).toEqual([11, 12, 13, 14, 15]);
		expect(body.rows[0].speed_mps).toBeCloseTo(20, 12);
		expect(body.rows[0].downstream_m).toBeCloseTo(0.5, 12);
		// Continuity estimate at A/C = 0.04: (1 + 0.01)² (Barlow, Rae & Pope, from memory).
		expect(body.rows[0].correctedDynamicPressure_Pa / body.rows[0].dynamicPressure_Pa).toBeCloseTo(
			1.0201,
			10
		);
		expect(body.findings.map((f: { code: string }) => f.code)).toEqual([
			'speed-above-envelope',
			'yaw-outside-turntable'
		]);
		expect(body.occupancy.breakdown.modelChanges_s).toBe(1800);
		expect(body.occupancy.breakdown.setUpAndTearDown_s).toBe(10800);
	});
});
