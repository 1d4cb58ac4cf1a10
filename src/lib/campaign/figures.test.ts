import { describe, expect, it } from 'vitest';
import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from '../../../scripts/demo-scenario';
import { campaignFigures } from './figures';

// The demo's AM-3 sweep (nine speeds, 15–55 m/s) as input only; the checks are on the shape of
// the findings, not on demo numbers.
const sweep = DEMO_CAMPAIGNS[1]!.input;
const demoModel = DEMO_MODELS[1]!.model;
const model = {
	...demoModel,
	dragCoefficient: demoModel.dragCoefficient ?? null,
	modelVolume_m3: demoModel.modelVolume_m3 ?? null
};
const facility = {
	...DEMO_FACILITIES[0]!,
	cornerFillet_m: DEMO_FACILITIES[0]!.cornerFillet_m ?? 0
};

describe('findings a person can read', () => {
	it('gives a nine-speed sweep one Re finding naming the speeds and the range', () => {
		const figures = campaignFigures(sweep, model, facility);
		const re = figures.findings.filter(
			(f) => f.code === 're-gap' || f.code === 'equal-re-unreachable'
		);
		expect(re).toHaveLength(1);
		expect(re[0]!.message).toMatch(/at 15–55 m\/s \(9 speeds\)/);
		const ratios = figures.speeds.map((s) => s.reRatio * 100);
		const lo = +Math.min(...ratios).toPrecision(2);
		const hi = +Math.max(...ratios).toPrecision(2);
		expect(re[0]!.message).toContain(`Model Re is ${lo}–${hi} % of full scale`);
		// No finding repeats per speed.
		const codes = figures.findings.map((f) => f.code);
		expect(new Set(codes).size).toBe(codes.length);
	});
});

describe('blockage inputs from the facility and the campaign', () => {
	it('takes τ from the facility for Thom/Herriot solid blockage', () => {
		// Thom/Herriot ε_sb = K·τ·V/C^1.5 (Barlow, Rae & Pope, Low-Speed Wind Tunnel Testing,
		// 3rd ed., ch. 10): proportional to τ.
		const thom = { ...sweep, blockageMethod: 'thom-herriot' as const };
		const at = (tunnelShapeFactor: number) =>
			campaignFigures(thom, model, { ...facility, tunnelShapeFactor }).blockage;
		expect(at(0.9).method).toBe('thom-herriot');
		expect(at(0.9).solidBlockage / at(0.86).solidBlockage).toBeCloseTo(0.9 / 0.86, 12);
	});

	it('uses the method the campaign chose, whatever inputs the model has', () => {
		// The demo model has both C_D and a volume; the choice decides.
		expect(
			campaignFigures({ ...sweep, blockageMethod: 'none' }, model, facility).blockage
		).toMatchObject({ method: 'none', dynamicPressureFactor: 1 });
		expect(campaignFigures(sweep, model, facility).blockage.method).toBe('maskell');
	});
});
