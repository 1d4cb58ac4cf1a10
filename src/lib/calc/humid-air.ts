import type { AirState } from './air-state';
import { ISA, sutherlandViscosity } from './atmosphere';
import { CalcInputError, requireInRange } from './errors';

// CIPM-2007 equation for the density of moist air: Picard, Davis, Gläser and Fujii,
// Metrologia 45 (2008) 149–155. Constants as printed there (Appendix A1).
const MOLAR_GAS_CONSTANT = 8.314472; // J/(mol·K)
const MOLAR_MASS_WATER = 18.01528e-3; // kg/mol
const SAT = { A: 1.2378847e-5, B: -1.9121316e-2, C: 33.93711047, D: -6.3431645e3 };
const ENHANCEMENT = { alpha: 1.00062, beta: 3.14e-8, gamma: 5.6e-7 };
const Z = {
	a0: 1.58123e-6,
	a1: -2.9331e-8,
	a2: 1.1043e-10,
	b0: 5.707e-6,
	b1: -2.051e-8,
	c0: 1.9898e-4,
	c1: -2.376e-6,
	d: 1.83e-11,
	e: -0.765e-8
};

export const DEFAULT_CO2_MOLE_FRACTION = 0.0004;

/** Saturation vapour pressure over water, CIPM-2007 eq. A1.1. Pa. */
export function saturationVapourPressure(temperature_K: number): number {
	requireInRange('temperature_K', temperature_K, 233.15, 373.15);
	const T = temperature_K;
	return Math.exp(SAT.A * T * T + SAT.B * T + SAT.C + SAT.D / T);
}

/** Molar mass of dry air with the given CO2 mole fraction, CIPM-2007 eq. A1.2. kg/mol. */
function molarMassDryAir(co2MoleFraction: number): number {
	return (28.96546 + 12.011 * (co2MoleFraction - 0.0004)) * 1e-3;
}

/**
 * Humid air at a temperature, pressure and relative humidity. Density by CIPM-2007 (with its
 * compressibility factor Z); viscosity by Sutherland for dry air, since water vapour at tunnel
 * humidities changes it by well under 1 %; speed of sound √(κ·R·T/M) with the mixture's molar
 * mass and the dry-air κ.
 */
export function airState(x: {
	temperature_K: number;
	pressure_Pa: number;
	relativeHumidity?: number;
	co2MoleFraction?: number;
}): AirState {
	const T = requireInRange('temperature_K', x.temperature_K, 233.15, 333.15);
	const p = requireInRange('pressure_Pa', x.pressure_Pa, 10_000, 200_000);
	const h = requireInRange('relativeHumidity', x.relativeHumidity ?? 0, 0, 1);
	const xCO2 = requireInRange(
		'co2MoleFraction',
		x.co2MoleFraction ?? DEFAULT_CO2_MOLE_FRACTION,
		0,
		0.01
	);

	const t = T - 273.15;
	const f = ENHANCEMENT.alpha + ENHANCEMENT.beta * p + ENHANCEMENT.gamma * t * t;
	const xv = (h * f * saturationVapourPressure(T)) / p;
	if (xv >= 0.2) {
		throw new CalcInputError(
			'relativeHumidity',
			h,
			'low enough that water vapour stays below 20 % of the mixture at this temperature and pressure'
		);
	}
	const compressibility =
		1 -
		(p / T) *
			(Z.a0 + Z.a1 * t + Z.a2 * t * t + (Z.b0 + Z.b1 * t) * xv + (Z.c0 + Z.c1 * t) * xv * xv) +
		((p * p) / (T * T)) * (Z.d + Z.e * xv * xv);
	const Ma = molarMassDryAir(xCO2);
	const density_kgm3 =
		((p * Ma) / (compressibility * MOLAR_GAS_CONSTANT * T)) *
		(1 - xv * (1 - MOLAR_MASS_WATER / Ma));

	const mixtureMolarMass = Ma * (1 - xv) + MOLAR_MASS_WATER * xv;
	const dynamicViscosity_Pas = sutherlandViscosity(T);
	return {
		temperature_K: T,
		pressure_Pa: p,
		density_kgm3,
		speedOfSound_mps: Math.sqrt(
			(ISA.heatCapacityRatio * MOLAR_GAS_CONSTANT * T) / mixtureMolarMass
		),
		dynamicViscosity_Pas,
		kinematicViscosity_m2s: dynamicViscosity_Pas / density_kgm3
	};
}
