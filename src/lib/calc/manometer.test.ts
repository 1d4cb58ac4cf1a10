import { describe, expect, it } from 'vitest';
import { CalcInputError, convert, manometerPressure } from './index';

describe('manometerPressure', () => {
	it('reads a vertical water column as the conventional mm of water', () => {
		// NIST SP 811 (2008), Appendix B.8: 1 conventional mmH2O = 9.806 65 Pa.
		expect(manometerPressure({ height_m: 0.025 })).toBeCloseTo(25 * 9.80665, 9);
		expect(manometerPressure({ height_m: 0.025 })).toBeCloseTo(convert(25, 'mmH2O', 'Pa'), 9);
	});

	it('reads an inclined tube of another fluid as h·ρ·g·sin θ', () => {
		// Hydrostatics of the inclined-tube manometer, Δp = ρ g L sin θ (White, Fluid Mechanics,
		// 7th ed., §2.4): 50 mm of a 826 kg/m³ oil along a tube at 20° from horizontal.
		// Evaluated by hand: 0.05 × 826 × 9.80665 × sin 20° = 138.523 Pa.
		expect(
			manometerPressure({ height_m: 0.05, fluidDensity_kgm3: 826, inclination_deg: 20 })
		).toBeCloseTo(138.523, 3);
	});

	it('keeps the sign of a column below zero (suction)', () => {
		// NIST SP 811 (2008), Appendix B.8.
		expect(manometerPressure({ height_m: -0.002 })).toBeCloseTo(-2 * 9.80665, 9);
	});

	it('refuses an angle outside (0°, 90°] and a fluid without density', () => {
		expect(() => manometerPressure({ height_m: 0.01, inclination_deg: 0 })).toThrow(CalcInputError);
		expect(() => manometerPressure({ height_m: 0.01, inclination_deg: 95 })).toThrow(
			CalcInputError
		);
		expect(() => manometerPressure({ height_m: 0.01, fluidDensity_kgm3: 0 })).toThrow(
			CalcInputError
		);
		expect(() => manometerPressure({ height_m: Number.NaN })).toThrow(CalcInputError);
	});
});
