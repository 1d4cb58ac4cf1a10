import { requireFinite, requireInRange, requirePositive } from './errors';

/** Standard acceleration of gravity, g_n (CGPM 1901; NIST SP 811 §B.8 uses it for mmH2O). */
export const STANDARD_GRAVITY_MPS2 = 9.80665;
/** The water density of the conventional mm and inch of water (NIST SP 811, Appendix B.8). */
export const CONVENTIONAL_WATER_DENSITY_KGM3 = 1000;

export type ManometerReading = {
	/** Length of the liquid column along the tube. */
	height_m: number;
	fluidDensity_kgm3?: number;
	gravity_mps2?: number;
	/** The tube's angle from horizontal; 90 for a vertical tube. */
	inclination_deg?: number;
};

/**
 * Pressure difference a liquid column stands for: Δp = h·ρ·g·sin θ (hydrostatics, e.g. White,
 * *Fluid Mechanics*, §2.4 on manometers; the inclined tube reads h along its axis). The air
 * column's own weight is neglected, as conventional manometer units do.
 */
export function manometerPressure(x: ManometerReading): number {
	const h = requireFinite('height_m', x.height_m);
	const rho = requirePositive(
		'fluidDensity_kgm3',
		x.fluidDensity_kgm3 ?? CONVENTIONAL_WATER_DENSITY_KGM3
	);
	const g = requirePositive('gravity_mps2', x.gravity_mps2 ?? STANDARD_GRAVITY_MPS2);
	const theta = requireInRange('inclination_deg', x.inclination_deg ?? 90, 0, 90, {
		openMin: true
	});
	return h * rho * g * Math.sin((theta * Math.PI) / 180);
}
