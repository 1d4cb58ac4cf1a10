import { convert } from '../../calc';
import type { MeasuredConditions } from '../../readings/types';
import type { ReadingRow } from '../../schemas/readings';
import type { ProblemList } from './problems';
import { PHYSICAL_RANGES, pascalText, toSI } from './row-units';

/** How far a run's rows may disagree on its reference conditions (common practice, no source). */
export const RUN_CONDITION_TOLERANCES = {
	/** Spread of the reference dynamic pressure, as a fraction of its mean. */
	dynamicPressure: 0.02,
	temperature_K: 0.5,
	/** Spread of the barometric pressure, as a fraction of its mean. */
	barometricPressure: 0.002,
	relativeHumidity: 0.05
} as const;

type Quantity = keyof typeof RUN_CONDITION_TOLERANCES;
const RELATIVE: ReadonlySet<Quantity> = new Set(['dynamicPressure', 'barometricPressure']);

/** The largest difference two values of a condition may have and still agree, near `scale`. */
export function allowedDifference(quantity: Quantity, scale: number): number {
	const t = RUN_CONDITION_TOLERANCES[quantity];
	return RELATIVE.has(quantity) ? t * scale : t;
}

/** Whether a file's conditions for a run agree with the stored ones `b`, within the tolerances. */
export function conditionsAgree(a: MeasuredConditions, b: MeasuredConditions): boolean {
	const near = (quantity: Quantity, x: number, y: number) =>
		Math.abs(x - y) <= allowedDifference(quantity, y);
	return (
		near('dynamicPressure', a.referenceDynamicPressure_Pa, b.referenceDynamicPressure_Pa) &&
		near('temperature_K', a.airTemperature_K, b.airTemperature_K) &&
		near('barometricPressure', a.barometricPressure_Pa, b.barometricPressure_Pa) &&
		(a.relativeHumidity === null ||
			b.relativeHumidity === null ||
			near('relativeHumidity', a.relativeHumidity, b.relativeHumidity))
	);
}

/** Kelvin at 0 °C, from the core's conversion once: a per-row conversion would be 300 000 calls. */
const CELSIUS_ZERO_K = convert(0, 'C', 'K');
const celsiusText = (t_K: number) => `${+(t_K - CELSIUS_ZERO_K).toFixed(2)}`;

/** A running minimum, maximum and sum of one run condition. */
class Spread {
	min = Infinity;
	max = -Infinity;
	sum = 0;
	n = 0;
	add(v: number) {
		this.min = Math.min(this.min, v);
		this.max = Math.max(this.max, v);
		this.sum += v;
		this.n++;
	}
	/** Equal values give that value back exactly, without the sum's rounding. */
	get mean() {
		return this.min === this.max ? this.min : this.sum / this.n;
	}
}

/** Each condition: its file column, its words, and how a disagreement is written. */
type Condition = {
	quantity: Quantity;
	column: string;
	what: string;
	range: (lo: number, hi: number) => string;
	apart: string;
};
const CONDITIONS: readonly Condition[] = [
	{
		quantity: 'dynamicPressure',
		column: 'reference_dynamic_pressure',
		what: 'reference dynamic pressure',
		range: (lo: number, hi: number) => `${pascalText(lo)} to ${pascalText(hi)}`,
		apart: `${RUN_CONDITION_TOLERANCES.dynamicPressure * 100} %`
	},
	{
		quantity: 'temperature_K',
		column: 'air_temperature_c',
		what: 'air temperature',
		range: (lo: number, hi: number) => `${celsiusText(lo)} to ${celsiusText(hi)} °C`,
		apart: `${RUN_CONDITION_TOLERANCES.temperature_K} K`
	},
	{
		quantity: 'barometricPressure',
		column: 'barometric_pressure',
		what: 'barometric pressure',
		range: (lo: number, hi: number) => `${pascalText(lo)} to ${pascalText(hi)}`,
		apart: `${RUN_CONDITION_TOLERANCES.barometricPressure * 100} %`
	},
	{
		quantity: 'relativeHumidity',
		column: 'relative_humidity',
		what: 'relative humidity',
		range: (lo: number, hi: number) => `${lo} to ${hi}`,
		apart: `${RUN_CONDITION_TOLERANCES.relativeHumidity}`
	}
];

/**
 * One run's reference conditions gathered from its rows: each row may repeat them, and they
 * must agree within the tolerances. Humidity alone may be left out.
 */
export class RunConditionsGathering {
	private readonly spreads: Record<Quantity, Spread> = {
		dynamicPressure: new Spread(),
		temperature_K: new Spread(),
		barometricPressure: new Spread(),
		relativeHumidity: new Spread()
	};

	/** `firstRow` is where problems with the run as a whole are reported. */
	constructor(
		readonly run: number,
		readonly firstRow: number
	) {}

	/** Takes a row's conditions in SI units, or a problem for a missing unit or a value out of range. */
	add(r: ReadingRow, row: number, problems: ProblemList) {
		const s = this.spreads;
		if (r.reference_dynamic_pressure !== undefined) {
			if (!r.reference_unit)
				problems.add(row, 'reference_unit', 'is required with a reference dynamic pressure');
			else {
				const q = toSI(r.reference_dynamic_pressure, r.reference_unit, 'Pa');
				const max = PHYSICAL_RANGES.dynamicPressure_Pa;
				if (q <= 0 || q > max)
					problems.add(
						row,
						'reference_dynamic_pressure',
						`${pascalText(q)} is outside the physical range (above 0, up to ${max / 1000} kPa)`
					);
				else s.dynamicPressure.add(q);
			}
		}
		if (r.air_temperature_c !== undefined) {
			const [min, max] = PHYSICAL_RANGES.temperature_C;
			if (r.air_temperature_c < min || r.air_temperature_c > max)
				problems.add(
					row,
					'air_temperature_c',
					`${r.air_temperature_c} °C is outside ${min} to ${max} °C`
				);
			else s.temperature_K.add(r.air_temperature_c + CELSIUS_ZERO_K);
		}
		if (r.barometric_pressure !== undefined) {
			if (!r.barometric_unit)
				problems.add(row, 'barometric_unit', 'is required with a barometric pressure');
			else {
				const p = toSI(r.barometric_pressure, r.barometric_unit, 'Pa');
				const [min, max] = PHYSICAL_RANGES.barometric_Pa;
				if (p < min || p > max)
					problems.add(
						row,
						'barometric_pressure',
						`${pascalText(p)} is outside the physical range (${min / 1000}–${max / 1000} kPa)`
					);
				else s.barometricPressure.add(p);
			}
		}
		if (r.relative_humidity !== undefined) s.relativeHumidity.add(r.relative_humidity);
	}

	/** The run's conditions, or problems where one is missing from every row or the rows disagree. */
	conditions(problems: ProblemList): (MeasuredConditions & { run: number }) | undefined {
		let ok = true;
		for (const c of CONDITIONS) {
			const s = this.spreads[c.quantity];
			if (s.n === 0) {
				if (c.quantity === 'relativeHumidity') continue;
				problems.add(
					this.firstRow,
					c.column,
					`run ${this.run} has no ${c.what} on any of its rows`
				);
				ok = false;
			} else if (s.max - s.min > allowedDifference(c.quantity, s.mean)) {
				problems.add(
					this.firstRow,
					c.column,
					`run ${this.run}'s rows disagree: ${c.range(s.min, s.max)}, more than ${c.apart} apart`
				);
				ok = false;
			}
		}
		if (!ok) return undefined;
		const s = this.spreads;
		return {
			run: this.run,
			referenceDynamicPressure_Pa: s.dynamicPressure.mean,
			airTemperature_K: s.temperature_K.mean,
			barometricPressure_Pa: s.barometricPressure.mean,
			relativeHumidity: s.relativeHumidity.n ? s.relativeHumidity.mean : null
		};
	}
}
