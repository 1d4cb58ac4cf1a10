import { CalcInputError, pressureCoefficient, propagateUncertainty, wakeSurveyDrag } from '../calc';
import type { InstrumentUncertainties } from './input';
import { mapGrid, type RunReadings } from './run-grids';
import type { WakeDrag } from './types';

/**
 * Wake drag with its uncertainty from the reference q and the readings, the latter taken as
 * a zero offset common to every probe: an integral averages independent scatter away, so the
 * shared offset is the part that matters (JCGM 100:2008 eq. 10 over those two inputs).
 */
export function wakeDrag(
	rr: RunReadings,
	y_m: number[],
	z_m: number[],
	q: number,
	referenceArea_m2: number,
	instrument: InstrumentUncertainties
): WakeDrag | null {
	const paired = rr.gauge.some((row, i) =>
		row.some((v, j) => v !== null && rr.total[i]![j] !== null)
	);
	if (!paired || y_m.length < 2 || z_m.length < 2) return null;
	const drag = (scale: number, offset_Pa: number) =>
		wakeSurveyDrag({
			y_m,
			z_m,
			pressureCoefficient: mapGrid(rr.gauge, (p) => pressureCoefficient(p + offset_Pa, q * scale)),
			totalPressureCoefficient: mapGrid(rr.total, (p) =>
				pressureCoefficient(p + offset_Pa, q * scale)
			),
			referenceArea_m2
		});
	let nominal: ReturnType<typeof drag>;
	try {
		nominal = drag(1, 0);
	} catch (error) {
		// A plane whose probe positions are not in increasing order cannot be integrated.
		if (error instanceof CalcInputError) return null;
		throw error;
	}
	const budget = propagateUncertainty(
		(x) => drag(x.scale!, x.offset!).dragCoefficient,
		[
			{ name: 'scale', value: 1, standardUncertainty: instrument.referenceQUncertainty },
			{ name: 'offset', value: 0, standardUncertainty: instrument.readingUncertainty_Pa }
		]
	);
	return { ...nominal, uncertainty: budget.standardUncertainty, referenceArea_m2 };
}
