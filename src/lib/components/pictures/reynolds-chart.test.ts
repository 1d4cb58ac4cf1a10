import { describe, expect, it } from 'vitest';
import { isaAtmosphere, reynoldsNumber } from '$lib/calc';
import { placeReferences, reynoldsSummary, sampleSpeeds, speedReaching } from './reynolds-chart';

const sea = isaAtmosphere(0);
const reAt = (speed_mps: number) => reynoldsNumber(speed_mps, 0.88, sea);

describe('the model line', () => {
	it('starts at the speed where Re reaches the bottom of the axis', () => {
		// ISO 2533:1975 sea level: ν = μ/ρ = 1.7894e-5 / 1.225 m²/s, so Re = 1e6 over 0.88 m at
		// V = 1e6·ν/L.
		const expected_mps = (1e6 * (1.7894e-5 / 1.225)) / 0.88;
		expect(speedReaching(reAt, 1e6, 0, 60)).toBeCloseTo(expected_mps, 2);
	});

	it('starts at the span’s start when that is already on the axis, and is empty beyond it', () => {
		expect(speedReaching(reAt, 1e3, 5, 60)).toBe(5);
		expect(speedReaching(reAt, 1e9, 5, 60)).toBe(60);
		expect(sampleSpeeds(60, 60, 64)).toEqual([]);
		expect(sampleSpeeds(0, 10, 4)).toEqual([0, 2.5, 5, 7.5, 10]);
	});
});

describe('reference labels', () => {
	const lines = [
		{ value: 1, name: 'low', colour: 'a' },
		{ value: 2, name: 'high', colour: 'b' }
	];
	const place = (highY: number, lowY: number) =>
		placeReferences(lines, (v) => (v === 2 ? highY : lowY), { top: 44, bottom: 320 }, 18).map(
			(r) => [r.name, r.labelAbove]
		);

	it('puts the higher label above its line and the lower below', () => {
		expect(place(100, 200)).toEqual([
			['high', true],
			['low', false]
		]);
	});

	it('turns a label over where it would leave the plot', () => {
		expect(place(50, 310)).toEqual([
			['high', false],
			['low', true]
		]);
	});
});

describe('the chart in words', () => {
	it('counts the campaign speeds the envelope check marks', () => {
		const summary = reynoldsSummary({
			speedRange_mps: [5, 60],
			modelReferenceLength_m: 0.88,
			modelReAt: reAt,
			fullScaleRe: null,
			threshold: null,
			points: [
				{ speed_mps: 40, modelRe: reAt(40), outsideEnvelope: false },
				{ speed_mps: 70, modelRe: reAt(70), outsideEnvelope: true }
			]
		});
		expect(summary).toContain('campaign speeds 40, 70 m/s');
		expect(summary).toContain("1 outside the facility's envelope");
	});
});
