import type { AirState } from './air-state';
import { CalcInputError, requireFinite, requireInRange } from './errors';

/**
 * ISA constants: ISO 2533:1975 and ICAO Doc 7488/3; the U.S. Standard Atmosphere 1976 is
 * identical up to 86 km geometric altitude.
 */
export const ISA = {
	seaLevelTemperature_K: 288.15,
	seaLevelPressure_Pa: 101_325,
	seaLevelDensity_kgm3: 1.225,
	gravity_mps2: 9.80665,
	gasConstant_JkgK: 287.05287,
	heatCapacityRatio: 1.4,
	earthRadius_m: 6_356_766,
	sutherlandBeta: 1.458e-6, // kg/(m·s·K^½)
	sutherlandS_K: 110.4
} as const;

export const ISA_MIN_ALTITUDE_M = -2_000;
export const ISA_MAX_ALTITUDE_M = 84_852;

/** Layer bases by geopotential altitude and their temperature lapse rates (ISO 2533 table 4). */
const LAYER_SPECS: { base_m: number; lapse_Km: number }[] = [
	{ base_m: 0, lapse_Km: -0.0065 },
	{ base_m: 11_000, lapse_Km: 0 },
	{ base_m: 20_000, lapse_Km: 0.001 },
	{ base_m: 32_000, lapse_Km: 0.0028 },
	{ base_m: 47_000, lapse_Km: 0 },
	{ base_m: 51_000, lapse_Km: -0.0028 },
	{ base_m: 71_000, lapse_Km: -0.002 }
];

type Layer = {
	base_m: number;
	lapse_Km: number;
	baseTemperature_K: number;
	basePressure_Pa: number;
};

function layerState(
	layer: Layer,
	altitude_m: number
): { temperature_K: number; pressure_Pa: number } {
	const { gravity_mps2: g0, gasConstant_JkgK: R } = ISA;
	const dH = altitude_m - layer.base_m;
	const temperature_K = layer.baseTemperature_K + layer.lapse_Km * dH;
	const pressure_Pa =
		layer.lapse_Km === 0
			? layer.basePressure_Pa * Math.exp((-g0 * dH) / (R * layer.baseTemperature_K))
			: layer.basePressure_Pa *
				(temperature_K / layer.baseTemperature_K) ** (-g0 / (layer.lapse_Km * R));
	return { temperature_K, pressure_Pa };
}

// Base temperatures and pressures follow from sea level through the layer equations, so the
// profile is continuous by construction.
const LAYERS: Layer[] = [];
for (const spec of LAYER_SPECS) {
	const below = LAYERS.at(-1);
	const base = below
		? layerState(below, spec.base_m)
		: { temperature_K: ISA.seaLevelTemperature_K, pressure_Pa: ISA.seaLevelPressure_Pa };
	LAYERS.push({
		...spec,
		baseTemperature_K: base.temperature_K,
		basePressure_Pa: base.pressure_Pa
	});
}

/** μ = βs·T^1.5 / (T + S), the ISA form of Sutherland's law (ISO 2533:1975, eq. 22). Pa·s. */
export function sutherlandViscosity(temperature_K: number): number {
	requireInRange('temperature_K', temperature_K, 1, 5_000);
	return (ISA.sutherlandBeta * temperature_K ** 1.5) / (temperature_K + ISA.sutherlandS_K);
}

/** a = √(κ·R·T) for dry air. m/s. */
export function speedOfSound(temperature_K: number): number {
	requireInRange('temperature_K', temperature_K, 1, 5_000);
	return Math.sqrt(ISA.heatCapacityRatio * ISA.gasConstant_JkgK * temperature_K);
}

/** Dry air at a temperature and pressure: density from the gas law, Sutherland viscosity. */
export function dryAirState(temperature_K: number, pressure_Pa: number): AirState {
	const density_kgm3 = pressure_Pa / (ISA.gasConstant_JkgK * temperature_K);
	const dynamicViscosity_Pas = sutherlandViscosity(temperature_K);
	return {
		temperature_K,
		pressure_Pa,
		density_kgm3,
		speedOfSound_mps: speedOfSound(temperature_K),
		dynamicViscosity_Pas,
		kinematicViscosity_m2s: dynamicViscosity_Pas / density_kgm3
	};
}

/** Geopotential altitude H = r0·z / (r0 + z) for geometric altitude z (ISO 2533, eq. 8). */
export function geopotentialAltitude(geometricAltitude_m: number): number {
	requireInRange('geometricAltitude_m', geometricAltitude_m, -5_000, 1_000_000);
	return (ISA.earthRadius_m * geometricAltitude_m) / (ISA.earthRadius_m + geometricAltitude_m);
}

/**
 * The ISA at a geopotential altitude. A temperature offset follows the ISA ± ΔT convention:
 * the pressure stays that of the ISA at the altitude, the temperature shifts by the offset,
 * and density follows from the gas law.
 */
export function isaAtmosphere(
	geopotentialAltitude_m: number,
	opts: { temperatureOffset_K?: number } = {}
): AirState {
	requireInRange(
		'geopotentialAltitude_m',
		geopotentialAltitude_m,
		ISA_MIN_ALTITUDE_M,
		ISA_MAX_ALTITUDE_M
	);
	const offset_K = requireFinite('temperatureOffset_K', opts.temperatureOffset_K ?? 0);
	const layer = LAYERS.findLast((l) => geopotentialAltitude_m >= l.base_m) ?? LAYERS[0]!;
	const { temperature_K, pressure_Pa } = layerState(layer, geopotentialAltitude_m);
	const shifted_K = temperature_K + offset_K;
	if (shifted_K <= 100) {
		throw new CalcInputError(
			'temperatureOffset_K',
			offset_K,
			`more than ${(100 - temperature_K).toFixed(2)} K at this altitude (temperature above 100 K)`
		);
	}
	return dryAirState(shifted_K, pressure_Pa);
}
