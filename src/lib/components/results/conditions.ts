import { fixed, percent } from '$lib/format';
import type { RunConditions } from '$lib/results/types';
import { formatCompact } from '../pictures/number-format';
import { expanded, plusMinus } from './figures';

/** A run's measured air and flow as written in every conditions table, uncertainties as U. */
export function conditionTexts(c: RunConditions, referenceQUncertainty: number) {
	return {
		speed: plusMinus(c.measuredSpeed_mps, c.uncertainty.measuredSpeed_mps, 2),
		plannedSpeed: fixed(c.plannedSpeed_mps, 2),
		re: `${formatCompact(c.achievedRe)} ± ${formatCompact(expanded(c.uncertainty.achievedRe))}`,
		plannedRe: formatCompact(c.plannedRe),
		mach: fixed(c.achievedMach, 4),
		plannedMach: fixed(c.plannedMach, 4),
		// The reference q's uncertainty is a fraction of it (the facility's calibration).
		q: plusMinus(
			c.referenceDynamicPressure_Pa,
			referenceQUncertainty * c.referenceDynamicPressure_Pa,
			2
		),
		density: plusMinus(c.density_kgm3, c.uncertainty.density_kgm3, 4),
		temperature: fixed(c.airTemperature_K - 273.15, 1),
		pressure: fixed(c.barometricPressure_Pa / 100, 1),
		humidity: c.relativeHumidity === null ? 'not given: dry air' : percent(c.relativeHumidity, 0)
	};
}
