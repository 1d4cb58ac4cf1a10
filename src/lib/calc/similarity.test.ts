import { describe, expect, it } from 'vitest';
import {
	airState,
	CalcInputError,
	convert,
	dryAirState,
	dynamicPressure,
	isaAtmosphere,
	machNumber,
	pitotSpeed,
	reynoldsNumber,
	similarity,
	type AirState
} from './index';

const rel = (actual: number, expected: number) => Math.abs(actual / expected - 1);

/** Air with the given density and viscosity, as in a textbook example; a from ISA sea level. */
function textbookAir(density_kgm3: number, dynamicViscosity_Pas: number): AirState {
	return {
		...isaAtmosphere(0),
		density_kgm3,
		dynamicViscosity_Pas,
		kinematicViscosity_m2s: dynamicViscosity_Pas / density_kgm3
	};
}

describe('flow quantities', () => {
	it('q = ½ρV²', () => {
		// q = ½ρV² (Anderson, Fundamentals of Aerodynamics, ch. 1), evaluated by hand:
		// ρ = 1.225 kg/m³, V = 30 m/s → 551.25 Pa.
		expect(dynamicPressure(30, textbookAir(1.225, 1.8e-5))).toBeCloseTo(551.25, 10);
	});

	it('Re and Mach of a car', () => {
		// Katz, Automotive Aerodynamics, Example 4.2: L = 4.0 m, 100 km/h, ρ = 1.22 kg/m³,
		// μ = 1.8e-5 Pa·s → Re ≈ 7.5e6, M ≈ 0.08.
		const air = textbookAir(1.22, 1.8e-5);
		const V = convert(100, 'km/h', 'm/s');
		expect(rel(reynoldsNumber(V, 4.0, air), 7.5e6)).toBeLessThan(0.01);
		expect(machNumber(V, air)).toBeCloseTo(0.08, 2);
	});

	it('pitot speed inverts q', () => {
		// V = √(2Δp/ρ) (Barlow, Rae & Pope, Low-Speed Wind Tunnel Testing, ch. 4), by hand: 551.25 Pa
		// at 1.225 kg/m³ is 30 m/s.
		expect(pitotSpeed(551.25, 1.225)).toBeCloseTo(30, 10);
	});

	it.each([
		() => reynoldsNumber(-1, 1, isaAtmosphere(0)),
		() => reynoldsNumber(10, 0, isaAtmosphere(0)),
		() => dynamicPressure(NaN, isaAtmosphere(0)),
		() => machNumber(10, { ...isaAtmosphere(0), speedOfSound_mps: 0 }),
		() => reynoldsNumber(10, 1, { ...isaAtmosphere(0), density_kgm3: -1 })
	])('refuses negative, zero or non-finite input (%#)', (call) => {
		expect(call).toThrow(CalcInputError);
	});
});

describe('similarity', () => {
	const sea = isaAtmosphere(0);
	const tunnel = airState({ temperature_K: 293.15, pressure_Pa: 100000, relativeHumidity: 0.5 });

	it('states the Re gap of a 1:4 model and the speed that would close it', () => {
		const s = similarity({
			scale: 1 / 4,
			fullScaleLength_m: 4.6,
			fullScaleSpeed_mps: 40,
			modelSpeed_mps: 50,
			fullScaleAir: sea,
			tunnelAir: tunnel
		});
		// Re ratio = (V_m·L_m/ν_m)/(V_f·L_f/ν_f); equal Re at V_f·(L_f/L_m)·(ν_m/ν_f) (Barlow, Rae &
		// Pope, Low-Speed Wind Tunnel Testing, ch. 1).
		const expectedRatio =
			(50 * 1.15) / tunnel.kinematicViscosity_m2s / ((40 * 4.6) / sea.kinematicViscosity_m2s);
		expect(s.reRatio).toBeCloseTo(expectedRatio, 12);
		expect(s.speedForEqualRe_mps).toBeCloseTo(
			40 * 4 * (tunnel.kinematicViscosity_m2s / sea.kinematicViscosity_m2s),
			9
		);
		expect(s.modelRe * (s.speedForEqualRe_mps / 50)).toBeCloseTo(s.fullScaleRe, 0);
		expect(s.machAtEqualRe).toBeGreaterThan(0.3);
		expect(s.notes.map((n) => [n.level, n.code])).toEqual([['limit', 'equal-re-unreachable']]);
	});

	it('flags a model speed above Mach 0.3 and Re below a stated threshold', () => {
		const s = similarity({
			scale: 1 / 10,
			fullScaleLength_m: 10,
			fullScaleSpeed_mps: 20,
			modelSpeed_mps: 120,
			fullScaleAir: sea,
			tunnelAir: dryAirState(288.15, 101325),
			reIndependenceThreshold: 1e8
		});
		expect(s.modelMach).toBeGreaterThan(0.3);
		expect(s.notes.map((n) => n.code).sort()).toEqual([
			'equal-re-unreachable',
			'mach-compressible',
			're-below-independence'
		]);
	});

	it('reports the equal-Re speed of a 1:500 building model instead of refusing it', () => {
		// A 1:500 model of a 50 m building at 25 m/s: equal Re needs 25·500·(ν_m/ν_f) ≈ 12 500 m/s
		// (V_m = V_f·(L_f/L_m)·(ν_m/ν_f), Barlow, Rae & Pope, ch. 1), far beyond any low-speed tunnel.
		const s = similarity({
			scale: 1 / 500,
			fullScaleLength_m: 50,
			fullScaleSpeed_mps: 25,
			modelSpeed_mps: 12,
			fullScaleAir: sea,
			tunnelAir: sea
		});
		expect(s.speedForEqualRe_mps).toBeCloseTo(12_500, 6);
		expect(s.machAtEqualRe).toBeCloseTo(12_500 / sea.speedOfSound_mps, 9);
		const unreachable = s.notes.find((n) => n.code === 'equal-re-unreachable')!;
		expect(unreachable.level).toBe('limit');
		expect(unreachable.message).toMatch(/12500 m\/s.*Re-independence/);
	});

	it('finds equal Re at full scale in the same air', () => {
		const s = similarity({
			scale: 1,
			fullScaleLength_m: 0.5,
			fullScaleSpeed_mps: 12,
			modelSpeed_mps: 12,
			fullScaleAir: sea,
			tunnelAir: sea
		});
		expect(s.reRatio).toBeCloseTo(1, 12);
		expect(s.speedForEqualRe_mps).toBeCloseTo(12, 12);
		expect(s.notes).toEqual([]);
	});

	it.each([0, -0.2, 1.5, NaN])('refuses scale %s', (scale) => {
		expect(() =>
			similarity({
				scale,
				fullScaleLength_m: 4,
				fullScaleSpeed_mps: 30,
				modelSpeed_mps: 40,
				fullScaleAir: sea,
				tunnelAir: sea
			})
		).toThrow(/^scale = \S+ is outside the valid range/);
	});
});
