import { describe, expect, it } from 'vitest';
import {
	CalcInputError,
	geopotentialAltitude,
	isaAtmosphere,
	speedOfSound,
	sutherlandViscosity
} from './index';

const rel = (actual: number, expected: number) => Math.abs(actual / expected - 1);

describe('ISA by geopotential altitude', () => {
	// Check values computed from the ICAO equations; they agree with the ICAO tables
	// (ISO 2533:1975 table 5 / ICAO Doc 7488/3; from memory).
	it.each([
		[1000, 281.65, 89874.6, 1.111643, 1.75785e-5],
		[2000, 275.15, 79495.2, 1.00649, 1.72596e-5],
		[5000, 255.65, 54019.9, 0.736116, 1.62812e-5],
		[11000, 216.65, 22632.0, 0.363918, 1.42161e-5],
		[20000, 216.65, 5474.9, 0.088035, 1.42161e-5]
	])('H = %d m', (H, T, p, rho, mu) => {
		const air = isaAtmosphere(H);
		expect(air.temperature_K).toBeCloseTo(T, 3);
		expect(rel(air.pressure_Pa, p)).toBeLessThan(2e-5);
		expect(rel(air.density_kgm3, rho)).toBeLessThan(1e-5);
		expect(rel(air.dynamicViscosity_Pas, mu)).toBeLessThan(1e-5);
	});

	it('has the ISO 2533 sea-level values', () => {
		const air = isaAtmosphere(0);
		// ISO 2533:1975 table 1 / ICAO Doc 7488/3; a0, μ0, ν0 as in the ICAO tables and the
		// Python `ambiance` library.
		expect(air.temperature_K).toBe(288.15);
		expect(air.pressure_Pa).toBe(101325);
		expect(rel(air.density_kgm3, 1.225)).toBeLessThan(1e-5);
		expect(air.speedOfSound_mps).toBeCloseTo(340.294, 3);
		expect(rel(air.dynamicViscosity_Pas, 1.7894e-5)).toBeLessThan(5e-5);
		expect(rel(air.kinematicViscosity_m2s, 1.4607e-5)).toBeLessThan(5e-5);
	});

	// Layer bases by geopotential altitude (ISO 2533:1975 table 4; U.S. Standard Atmosphere 1976
	// table 4), base pressures evaluated by hand from the hydrostatic layer equations of the same
	// standards.
	it.each([
		[32000, 228.65, 868.014],
		[47000, 270.65, 110.906],
		[51000, 270.65, 66.9384],
		[71000, 214.65, 3.95639],
		[84852, 186.946, 0.37338]
	])('layer base H = %d m', (H, T, p) => {
		const air = isaAtmosphere(H);
		expect(air.temperature_K).toBeCloseTo(T, 3);
		expect(rel(air.pressure_Pa, p)).toBeLessThan(1e-5);
	});

	it('extends below sea level to −2 000 m', () => {
		// ICAO Doc 7488/3 table at −2 000 m: 301.15 K, 127 774 Pa, 1.4782 kg/m³ (from memory).
		const air = isaAtmosphere(-2000);
		expect(air.temperature_K).toBeCloseTo(301.15, 6);
		expect(rel(air.pressure_Pa, 127774)).toBeLessThan(1e-5);
		expect(rel(air.density_kgm3, 1.4782)).toBeLessThan(1e-4);
	});
});

describe('ISA by geometric altitude, one point in every layer above the first', () => {
	// U.S. Standard Atmosphere 1976, Table I (geometric altitude), from memory; H from z by
	// ISO 2533 eq. 8 with r0 = 6 356 766 m.
	it.each([
		[15000, 216.65, 12111, 0.19476],
		[25000, 221.55, 2549.2, 0.040084],
		[30000, 226.51, 1197.0, 0.01841],
		[40000, 250.35, 287.14, 3.9957e-3],
		[50000, 270.65, 79.779, 1.0269e-3],
		[60000, 247.02, 21.958, 3.0968e-4],
		[70000, 219.58, 5.2209, 8.2829e-5],
		[80000, 198.64, 1.0524, 1.8458e-5]
	])('z = %d m', (z, T, p, rho) => {
		const air = isaAtmosphere(geopotentialAltitude(z));
		expect(Math.abs(air.temperature_K - T)).toBeLessThan(0.01);
		expect(rel(air.pressure_Pa, p)).toBeLessThan(2e-4);
		expect(rel(air.density_kgm3, rho)).toBeLessThan(2e-4);
	});
});

describe('temperature offset (ISA ± ΔT)', () => {
	it('keeps the ISA pressure, shifts the temperature, and takes density from the gas law', () => {
		const isa = isaAtmosphere(1500);
		const hot = isaAtmosphere(1500, { temperatureOffset_K: 15 });
		expect(hot.pressure_Pa).toBe(isa.pressure_Pa);
		expect(hot.temperature_K).toBeCloseTo(isa.temperature_K + 15, 10);
		expect(hot.density_kgm3).toBeCloseTo(
			isa.density_kgm3 * (isa.temperature_K / hot.temperature_K),
			12
		);
	});
});

describe('Sutherland viscosity, ISA constants', () => {
	// Bird, Stewart & Lightfoot, Transport Phenomena, Table 1.1-2, air at 1 atm.
	it.each([
		[0, 1.716e-5],
		[20, 1.813e-5],
		[40, 1.908e-5],
		[60, 1.999e-5]
	])('%d °C', (t, mu) => {
		expect(rel(sutherlandViscosity(t + 273.15), mu)).toBeLessThan(2e-3);
	});

	it('uses βs = 1.458e-6 and S = 110.4 K, not the mistyped forms', () => {
		// ISO 2533:1975 eq. 22: μ0 = 1.7894e-5 Pa·s at 288.15 K.
		expect(sutherlandViscosity(288.15)).toBeCloseTo(1.7894e-5, 9);
	});
});

describe('bad input', () => {
	it.each([-2001, 84853, NaN, Infinity])('rejects altitude %s with a named range', (H) => {
		expect(() => isaAtmosphere(H)).toThrow(CalcInputError);
		expect(() => isaAtmosphere(H)).toThrow(/geopotentialAltitude_m/);
	});

	it('rejects an offset that would take the air below 100 K', () => {
		expect(() => isaAtmosphere(80000, { temperatureOffset_K: -150 })).toThrow(
			/temperatureOffset_K/
		);
	});

	it('rejects a temperature that is not physical', () => {
		expect(() => speedOfSound(-10)).toThrow(CalcInputError);
		expect(() => sutherlandViscosity(NaN)).toThrow(/temperature_K = NaN/);
	});
});
