import { describe, expect, it } from 'vitest';
import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from '../../../scripts/demo-scenario';
import { expandMatrix } from '../calc';
import { campaignSchema, matrixPointCount } from '../schemas/campaign';
import { campaignFigures } from './figures';
import { liveFigures } from './live-figures';
import { seaLevelFacility, seaLevelForm, seaLevelModel } from './sea-level-campaign';

// ISO 2533:1975 table (ICAO Doc 7488), sea level: ρ = 1.225 kg/m³, μ = 1.7894e-5 Pa·s,
// a = 340.294 m/s.
const RHO = 1.225;
const MU = 1.7894e-5;
const A = 340.294;

function ready(form: unknown) {
	const live = liveFigures(form, seaLevelModel, seaLevelFacility);
	if (live.state !== 'ready') throw new Error(`expected figures, got ${JSON.stringify(live)}`);
	return live.figures;
}

describe("the editor's figures", () => {
	it('wait for a model and a facility', () => {
		expect(liveFigures(seaLevelForm, undefined, seaLevelFacility)).toEqual({ state: 'unchosen' });
		expect(liveFigures(seaLevelForm, seaLevelModel, undefined)).toEqual({ state: 'unchosen' });
	});

	it('give Re, q and Mach at each speed as the ISA sea-level air has them', () => {
		const [, at40] = ready(seaLevelForm).speeds;
		// Re = ρVL/μ with L = 4.4 m / 5 = 0.88 m at model scale.
		expect(at40!.modelRe / ((RHO * 40 * 0.88) / MU)).toBeCloseTo(1, 4);
		// q = ½ρV².
		expect(at40!.dynamicPressure_Pa).toBeCloseTo(0.5 * RHO * 40 ** 2, 1);
		expect(at40!.mach).toBeCloseTo(40 / A, 4);
	});

	it('take the blockage ratio over the section less its four corner fillets', () => {
		// Each 45° fillet of leg f removes a right triangle of area f²/2 (elementary geometry).
		const sectionArea_m2 = 2.4 * 1.8 - 4 * (0.15 ** 2 / 2);
		const frontalArea_m2 = 2.3 / 5 ** 2;
		expect(ready(seaLevelForm).blockage.ratio).toBeCloseTo(frontalArea_m2 / sectionArea_m2, 12);
	});

	it('mark a speed beyond the facility with the envelope check’s own finding', () => {
		const figures = ready({ ...seaLevelForm, speeds_mps: [20, 70] });
		expect(figures.speeds.map((s) => s.outsideEnvelope)).toEqual([false, true]);
		expect(figures.findings.find((f) => f.code === 'speed-above-envelope')?.message).toBe(
			"70 m/s: 70 m/s is above the facility's maximum of 60 m/s."
		);
	});

	it('name the value the core refuses instead of throwing', () => {
		// Thom/Herriot needs the model's volume, which this model lacks.
		const form = { ...seaLevelForm, blockageMethod: 'thom-herriot' };
		const live = liveFigures(form, seaLevelModel, seaLevelFacility);
		expect(live.state).toBe('problem');
		const def = campaignSchema.parse(form);
		expect(() => campaignFigures(def, seaLevelModel, seaLevelFacility)).toThrow(
			live.state === 'problem' ? live.problem : 'no problem'
		);
	});

	it('name the value the form refuses before computing', () => {
		expect(
			liveFigures({ ...seaLevelForm, speeds_mps: [] }, seaLevelModel, seaLevelFacility)
		).toEqual({ state: 'problem', problem: 'Check the form: Add at least one speed.' });
	});
});

describe('the demo campaigns', () => {
	it.each(DEMO_CAMPAIGNS.map((c) => [c.input.name, c] as const))(
		'%s plans as many points as its form counts',
		(_, c) => {
			const model = DEMO_MODELS.find((m) => m.model.name === c.model)!.model;
			const facility = DEMO_FACILITIES.find((f) => f.name === c.facility)!;
			const def = campaignSchema.parse({ ...c.input, modelId: 'm', facilityId: 'f' });
			const figures = campaignFigures(
				def,
				{
					...model,
					dragCoefficient: model.dragCoefficient ?? null,
					modelVolume_m3: model.modelVolume_m3 ?? null
				},
				{ ...facility, cornerFillet_m: facility.cornerFillet_m ?? 0 }
			);
			expect(figures.occupancy.counts.points).toBe(matrixPointCount(def));
			expect(expandMatrix(figures.plan)).toHaveLength(matrixPointCount(def));
		}
	);
});
