import { CalcInputError, requireFinite, requirePositive } from './errors';

/** A tiny divisor can overflow the quotient; refuse it rather than answer Infinity. */
function finiteQuotient(value: number, divisorName: string, divisor: number): number {
	if (!Number.isFinite(value)) {
		throw new CalcInputError(divisorName, divisor, 'large enough for a finite coefficient');
	}
	return value;
}

/**
 * Pressure coefficient Cp = (p − p∞)/q∞, dimensionless (the definition in e.g. Anderson,
 * *Fundamentals of Aerodynamics*, ch. 1). The gauge pressure is read against the free stream's
 * static pressure; both pressures in Pa.
 */
export function pressureCoefficient(gaugePressure_Pa: number, dynamicPressure_Pa: number): number {
	requireFinite('gaugePressure_Pa', gaugePressure_Pa);
	requirePositive('dynamicPressure_Pa', dynamicPressure_Pa);
	return finiteQuotient(
		gaugePressure_Pa / dynamicPressure_Pa,
		'dynamicPressure_Pa',
		dynamicPressure_Pa
	);
}

/**
 * Pressure coefficient referred to the blockage-corrected dynamic pressure:
 * Cp_c = 1 − (1 − Cp_u)·q_u/q_c, with dynamicPressureFactor = q_c/q_u as `blockage` returns it.
 * The correction changes the free stream's speed but not its total pressure, so
 * p0 − p = q_u·(1 − Cp_u) = q_c·(1 − Cp_c) (Bernoulli, Anderson, *Fundamentals of
 * Aerodynamics*, §3.2; the form in Barlow, Rae & Pope, *Low-Speed Wind Tunnel Testing*, 3rd ed.,
 * from memory).
 */
export function blockageCorrectedCp(cp: number, dynamicPressureFactor: number): number {
	requireFinite('cp', cp);
	requirePositive('dynamicPressureFactor', dynamicPressureFactor);
	return finiteQuotient(
		1 - (1 - cp) / dynamicPressureFactor,
		'dynamicPressureFactor',
		dynamicPressureFactor
	);
}
