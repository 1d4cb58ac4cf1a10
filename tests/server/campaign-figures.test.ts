import type { RequestEvent } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from '../../scripts/demo-scenario';
import { expandMatrix } from '../../src/lib/calc';
import { campaignFigures } from '../../src/lib/campaign/figures';
import { matrixSummaryRequest, similarityRequest } from '../../src/lib/campaign/requests';
import type { SessionUser } from '../../src/lib/roles';
import { campaignSchema, matrixPointCount } from '../../src/lib/schemas/campaign';
import { POST as matrixApi } from '../../src/routes/api/v1/calc/matrix/+server';
import { POST as similarityApi } from '../../src/routes/api/v1/calc/similarity/+server';
import { requestEvent } from './request-event';

const viewer: SessionUser = {
	id: 'u',
	email: 'u@x',
	name: 'u',
	roles: ['aerodynamicist'],
	teams: []
};
const post = async (handler: (e: RequestEvent) => unknown, body: unknown) => {
	const response = (await handler(requestEvent({ user: viewer, json: body }))) as Response;
	expect(response.status).toBe(200);
	return response.json();
};

// Every demo campaign with its model and facility: the demo data are inputs here; the check is
// that the editor's live path (calc API) and the stored campaign's path (server) agree.
const cases = DEMO_CAMPAIGNS.map((c) => {
	const model = DEMO_MODELS.find((m) => m.model.name === c.model)!.model;
	const facility = DEMO_FACILITIES.find((f) => f.name === c.facility)!;
	const def = campaignSchema.parse({ ...c.input, modelId: 'm', facilityId: 'f' });
	return [
		c.input.name,
		def,
		{
			...model,
			dragCoefficient: model.dragCoefficient ?? null,
			modelVolume_m3: model.modelVolume_m3 ?? null,
			referenceLength_m: model.referenceLength_m,
			fullScaleFrontalArea_m2: model.fullScaleFrontalArea_m2
		},
		{ ...facility, cornerFillet_m: facility.cornerFillet_m ?? 0 }
	] as const;
});

describe('live figures and stored figures agree', () => {
	it.each(cases)('%s', async (_, def, model, facility) => {
		const stored = campaignFigures(def, model, facility);
		expect(expandMatrix(stored.plan)).toHaveLength(matrixPointCount(def));

		const live = await post(matrixApi, matrixSummaryRequest(def, model, facility));
		expect(live.rowCount).toBe(stored.occupancy.counts.points);
		expect(live.occupancy.total_s).toBeCloseTo(stored.occupancy.total_s, 6);
		expect(live.blockage.dynamicPressureFactor).toBeCloseTo(
			stored.blockage.dynamicPressureFactor,
			12
		);
		live.speeds.forEach(
			(c: { correctedDynamicPressure_Pa: number; modelRe: number }, i: number) => {
				expect(c.correctedDynamicPressure_Pa).toBeCloseTo(
					stored.speeds[i]!.correctedDynamicPressure_Pa,
					9
				);
				expect(c.modelRe / stored.speeds[i]!.modelRe).toBeCloseTo(1, 12);
			}
		);

		const first = stored.speeds[0]!;
		const similarity = await post(similarityApi, similarityRequest(def, model, first.speed_mps));
		expect(similarity.fullScaleRe / first.fullScaleRe).toBeCloseTo(1, 12);
		expect(similarity.speedForEqualRe_mps).toBeCloseTo(first.speedForEqualRe_mps, 9);
	});
});
