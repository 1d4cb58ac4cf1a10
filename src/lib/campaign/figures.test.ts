import { describe, expect, it } from 'vitest';
import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from '../../../scripts/demo-scenario';
import { campaignFigures, speedList } from './figures';

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

	it('lists a few speeds in full and a long sweep as a range', () => {
		expect(speedList([20])).toBe('20 m/s');
		expect(speedList([25, 20])).toBe('20 and 25 m/s');
		expect(speedList([20, 25, 30])).toBe('20, 25 and 30 m/s');
		expect(speedList([15, 20, 25, 30, 35])).toBe('15–35 m/s (5 speeds)');
	});
});
