import type { AirState } from './air-state';
import { requireInRange, requirePositive } from './errors';

// Generous physical bounds: they keep every result finite and catch unit slips (mm for m).
const MAX_SPEED_MPS = 10_000;
const MAX_LENGTH_M = 100_000;
const requireSpeed = (v: number) => requireInRange('speed_mps', v, 0, MAX_SPEED_MPS);

/** Below about this Mach number the flow may be treated as incompressible (common practice). */
export const INCOMPRESSIBLE_MACH_LIMIT = 0.3;

function requireAir(air: AirState): AirState {
	requireInRange('air.density_kgm3', air.density_kgm3, 0, 1e4, { openMin: true });
	requireInRange('air.dynamicViscosity_Pas', air.dynamicViscosity_Pas, 1e-7, 1, { openMin: true });
	requirePositive('air.speedOfSound_mps', air.speedOfSound_mps);
	return air;
}

/** Re = ρ·V·L/μ. */
export function reynoldsNumber(speed_mps: number, length_m: number, air: AirState): number {
	requireSpeed(speed_mps);
	requireInRange('length_m', length_m, 0, MAX_LENGTH_M, { openMin: true });
	requireAir(air);
	return (air.density_kgm3 * speed_mps * length_m) / air.dynamicViscosity_Pas;
}

/** M = V/a. */
export function machNumber(speed_mps: number, air: AirState): number {
	requireSpeed(speed_mps);
	return speed_mps / requireAir(air).speedOfSound_mps;
}

/** q = ½·ρ·V², Pa. */
export function dynamicPressure(speed_mps: number, air: AirState): number {
	requireSpeed(speed_mps);
	return 0.5 * requireAir(air).density_kgm3 * speed_mps * speed_mps;
}

/** Pitot-static speed V = √(2·Δp/ρ), valid for M ≤ 0.3. m/s. */
export function pitotSpeed(differentialPressure_Pa: number, density_kgm3: number): number {
	requireInRange('differentialPressure_Pa', differentialPressure_Pa, 0, 1e8);
	requireInRange('density_kgm3', density_kgm3, 0, 1e4, { openMin: true });
	return Math.sqrt((2 * differentialPressure_Pa) / density_kgm3);
}
