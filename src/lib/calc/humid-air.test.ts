import psychrolib from 'psychrolib';
import { beforeAll, describe, expect, it } from 'vitest';
import {
	airState,
	CalcInputError,
	convert,
	humidAirViscosity,
	isaAtmosphere,
	saturationVapourPressure,
	sutherlandViscosity,
	waterVapourViscosity
} from './index';

const rel = (actual: number, expected: number) => Math.abs(actual / expected - 1);

beforeAll(() => psychrolib.SetUnitSystem(psychrolib.SI));

describe('CIPM-2007 humid-air density', () => {
	it('matches the worked check value', () => {
		// Gupta, Mass Metrology, Appendix: 10 °C, 730 mmHg, 40 % RH, 400 ppm CO2 → 1.19569 kg/m³.
		const air = airState({
			temperature_K: 283.15,
			pressure_Pa: convert(730, 'mmHg', 'Pa'),
			relativeHumidity: 0.4,
			co2MoleFraction: 0.0004
		});
		expect(Math.abs(air.density_kgm3 - 1.19569)).toBeLessThan(2e-5);
	});

	it('reduces to dry air close to the ISA sea-level density', () => {
		// ISO 2533:1975: 1.225 kg/m³ at 288.15 K, 101 325 Pa. CIPM-2007 differs from the ideal
		// gas by its compressibility factor Z and molar mass, a few parts in 10⁴.
		const dry = airState({ temperature_K: 288.15, pressure_Pa: 101325, relativeHumidity: 0 });
		expect(rel(dry.density_kgm3, isaAtmosphere(0).density_kgm3)).toBeLessThan(1e-3);
	});

	it.each([
		[15, 0.2],
		[20, 0.5],
		[25, 0.8],
		[30, 0.6]
	])('agrees with psychrolib (ASHRAE, ideal gas) at %d °C, %d RH', (t, rh) => {
		// psychrolib 1.1.1 (ASHRAE Handbook Fundamentals 2017 ch. 1) omits CIPM-2007's
		// compressibility factor Z (Picard et al., Metrologia 45 (2008) 149), about 1 − 3.5e-4 at
		// 20 °C, 50 % RH (from memory).
		const p = 101325;
		const w = psychrolib.GetHumRatioFromRelHum(t, rh, p);
		const reference = psychrolib.GetMoistAirDensity(t, w, p);
		const air = airState({ temperature_K: t + 273.15, pressure_Pa: p, relativeHumidity: rh });
		expect(rel(air.density_kgm3, reference)).toBeLessThan(1e-3);
	});

	it('makes humid air lighter than dry air at the same temperature and pressure', () => {
		const base = { temperature_K: 298.15, pressure_Pa: 100000 };
		expect(airState({ ...base, relativeHumidity: 0.9 }).density_kgm3).toBeLessThan(
			airState({ ...base, relativeHumidity: 0 }).density_kgm3
		);
	});
});

describe('saturation vapour pressure', () => {
	// ASHRAE Handbook Fundamentals 2017, via the PsychroLib tests: 5 °C 872.6 Pa, 25 °C 3169.7 Pa,
	// 50 °C 12351.3 Pa. CIPM-2007 uses a different fit; they agree within 0.1 %.
	it.each([
		[5, 872.6],
		[25, 3169.7],
		[50, 12351.3]
	])('%d °C', (t, psat) => {
		expect(rel(saturationVapourPressure(t + 273.15), psat)).toBeLessThan(1e-3);
		expect(rel(saturationVapourPressure(t + 273.15), psychrolib.GetSatVapPres(t))).toBeLessThan(
			1e-3
		);
	});
});

describe('saturation over ice below 0 °C', () => {
	it.each([-30, -10, -1])('%d °C agrees with psychrolib', (t) => {
		// ASHRAE Handbook—Fundamentals (2017) ch. 1 eq. 5 (Hyland & Wexler 1983, over ice), as
		// psychrolib 1.1.1 implements it independently.
		expect(rel(saturationVapourPressure(t + 273.15), psychrolib.GetSatVapPres(t))).toBeLessThan(
			1e-9
		);
	});

	it('is continuous enough at the triple point', () => {
		// Over ice and over water meet at 611.657 Pa at 0.01 °C (IAPWS, from memory).
		expect(rel(saturationVapourPressure(273.149), 611.2)).toBeLessThan(2e-3);
		expect(rel(saturationVapourPressure(273.15), 611.2)).toBeLessThan(2e-3);
	});
});

describe('humid-air viscosity', () => {
	it('is dry-air Sutherland when there is no vapour', () => {
		// Sutherland's law for dry air (as ISO 2533:1975 defines viscosity) is the Wilke rule's limit at x_v = 0.
		const dry = airState({ temperature_K: 303.15, pressure_Pa: 101325, relativeHumidity: 0 });
		expect(dry.dynamicViscosity_Pas).toBe(sutherlandViscosity(303.15));
		expect(humidAirViscosity(303.15, 0, 0.02896546)).toBe(sutherlandViscosity(303.15));
	});

	it('takes water vapour at the IAPWS dilute-gas viscosity', () => {
		// Steam near 100 °C at low pressure: about 12.3 µPa·s (IAPWS R12-08; from memory).
		expect(rel(waterVapourViscosity(373.15), 12.3e-6)).toBeLessThan(0.01);
	});

	it('makes warm saturated air a few per cent less viscous than dry air', () => {
		// Tsilingiris, Energy Conversion and Management 49 (2008) 1098, Fig. 4: at 40 °C the
		// viscosity of saturated air lies about 3–4 % below that of dry air (from memory).
		const humid = airState({ temperature_K: 313.15, pressure_Pa: 101325, relativeHumidity: 0.95 });
		const drop = 1 - humid.dynamicViscosity_Pas / sutherlandViscosity(313.15);
		expect(drop).toBeGreaterThan(0.025);
		expect(drop).toBeLessThan(0.045);
	});
});

describe('bad input', () => {
	it.each([
		[{ temperature_K: 293, pressure_Pa: 101325, relativeHumidity: 1.2 }, /relativeHumidity = 1.2/],
		[{ temperature_K: 293, pressure_Pa: 101325, relativeHumidity: -0.1 }, /relativeHumidity/],
		[{ temperature_K: NaN, pressure_Pa: 101325 }, /temperature_K = NaN/],
		[{ temperature_K: 293, pressure_Pa: -5 }, /pressure_Pa = -5/],
		[{ temperature_K: 293, pressure_Pa: 101325, co2MoleFraction: 0.5 }, /co2MoleFraction/]
	])('refuses %j', (input, message) => {
		expect(() => airState(input)).toThrow(CalcInputError);
		expect(() => airState(input)).toThrow(message);
	});
});
