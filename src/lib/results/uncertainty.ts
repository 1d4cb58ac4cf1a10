import { meanCpUncertainty, pressureCoefficient, propagateUncertainty } from '../calc';
import type { InstrumentUncertainties } from './input';
import type { Grid } from '../calc';

/**
 * Standard uncertainty of a mean Cp over n readings against one reference q, JCGM 100:2008
 * eq. 10 with inputs the mean reading (its readings independent, so u_p/√n) and q; the q term
 * does not shrink with n because every point shares it.
 */
export function averageCpUncertainty(
	average: number,
	n: number,
	q: number,
	instrument: InstrumentUncertainties
): number {
	return propagateUncertainty(
		(x) => pressureCoefficient(x.p!, x.q!),
		[
			{
				name: 'p',
				value: average * q,
				standardUncertainty: instrument.readingUncertainty_Pa / Math.sqrt(n)
			},
			{ name: 'q', value: q, standardUncertainty: instrument.referenceQUncertainty * q }
		]
	).standardUncertainty;
}

/** The same model as averageCpUncertainty in closed form, for every row, column and point. */
export const pointsUncertainty = (
	cp: number,
	n: number,
	q: number,
	instrument: InstrumentUncertainties
) =>
	meanCpUncertainty({
		cp,
		readings: n,
		dynamicPressure_Pa: q,
		readingUncertainty_Pa: instrument.readingUncertainty_Pa,
		relativeDynamicPressureUncertainty: instrument.referenceQUncertainty
	});

/** Sums of the static readings where both grids have one, for the difference's uncertainty. */
export function matchedMeans(variant: Grid, baseline: Grid) {
	let v = 0;
	let b = 0;
	let n = 0;
	variant.forEach((row, i) =>
		row.forEach((value, j) => {
			const base = baseline[i]?.[j];
			if (value === null || base === null || base === undefined) return;
			v += value;
			b += base;
			n++;
		})
	);
	return { variant_Pa: n ? v / n : 0, baseline_Pa: n ? b / n : 0, n };
}

/**
 * Uncertainty of a difference of two mean Cp, each against its own run's q from the same
 * reference instrument: the q inputs are fully correlated (JCGM 100:2008 eq. 13), so their
 * shared calibration error cancels where the two Cp agree instead of adding twice.
 */
export function differenceUncertainty(
	means: { variant_Pa: number; baseline_Pa: number; n: number },
	qVariant: number,
	qBaseline: number,
	instrument: InstrumentUncertainties
): number {
	const uMean = instrument.readingUncertainty_Pa / Math.sqrt(means.n);
	return propagateUncertainty(
		(x) => pressureCoefficient(x.pv!, x.qv!) - pressureCoefficient(x.pb!, x.qb!),
		[
			{ name: 'pv', value: means.variant_Pa, standardUncertainty: uMean },
			{ name: 'pb', value: means.baseline_Pa, standardUncertainty: uMean },
			{
				name: 'qv',
				value: qVariant,
				standardUncertainty: instrument.referenceQUncertainty * qVariant
			},
			{
				name: 'qb',
				value: qBaseline,
				standardUncertainty: instrument.referenceQUncertainty * qBaseline
			}
		],
		{ correlations: [{ a: 'qv', b: 'qb', r: 1 }] }
	).standardUncertainty;
}
