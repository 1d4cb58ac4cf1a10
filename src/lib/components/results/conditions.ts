import { convert } from '$lib/calc';
import { fixed, percent } from '$lib/format';
import type { RunConditions } from '$lib/results/types';
import { formatCompact } from '../pictures/number-format';
import { expanded, plusMinus } from './figures';

/** A run's measured air and flow as written in every conditions table, uncertainties as U. */
export function conditionTexts(c: RunConditions) {
	return {
		speed: plusMinus(c.measuredSpeed_mps, c.uncertainty.measuredSpeed_mps, 2),
		plannedSpeed: fixed(c.plannedSpeed_mps, 2),
		re: `${formatCompact(c.achievedRe)} ± ${formatCompact(expanded(c.uncertainty.achievedRe))}`,
		plannedRe: formatCompact(c.plannedRe),
		mach: fixed(c.achievedMach, 4),
		plannedMach: fixed(c.plannedMach, 4),
		q: plusMinus(c.referenceDynamicPressure_Pa, c.uncertainty.referenceDynamicPressure_Pa, 2),
		density: plusMinus(c.density_kgm3, c.uncertainty.density_kgm3, 4),
		temperature: fixed(convert(c.airTemperature_K, 'K', 'C'), 1),
		pressure: fixed(convert(c.barometricPressure_Pa, 'Pa', 'hPa'), 1),
		humidity: c.relativeHumidity === null ? 'not given: dry air' : percent(c.relativeHumidity, 0)
	};
}
