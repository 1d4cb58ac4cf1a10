import {
	COLUMN_LENGTH_UNITS,
	READING_PRESSURE_UNITS,
	convert,
	manometerPressure
} from '../../calc';
import type { ReadingRow } from '../../schemas/readings';
import type { ProblemList } from './problems';

/**
 * Physical ranges: gauge readings of a low-speed tunnel stay far inside ±50 kPa, barometric
 * pressures on the ground lie between 30 kPa (above the highest summit) and 120 kPa, and tunnel
 * air between −40 °C and 60 °C (common practice, no source).
 */
export const PHYSICAL_RANGES = {
	gauge_Pa: 50_000,
	absolute_Pa: [10_000, 200_000],
	barometric_Pa: [30_000, 120_000],
	temperature_C: [-40, 60],
	dynamicPressure_Pa: 50_000
} as const;

/** A pressure as problem texts write it: six significant figures in pascals. */
export const pascalText = (n: number) => `${+n.toPrecision(6)} Pa`;

/**
 * Pressure and length units are proportional, so each unit's factor is asked of the core's
 * conversion once and reused for every row.
 */
const factors = new Map<string, number>();
export function toSI(value: number, unit: string, si: 'Pa' | 'm'): number {
	const key = `${unit}>${si}`;
	let factor = factors.get(key);
	if (factor === undefined) {
		factor = convert(1, unit, si);
		factors.set(key, factor);
	}
	return value * factor;
}

const isLength = (unit: string) => (COLUMN_LENGTH_UNITS as readonly string[]).includes(unit);
const isPressure = (unit: string) => (READING_PRESSURE_UNITS as readonly string[]).includes(unit);

/**
 * A row's reading in pascals: a pressure unit converted, or a manometer column (a length with
 * its inclination or fluid density) turned into the pressure it stands for. A problem instead
 * when unit and manometer columns do not go together or the pressure is not physical.
 */
export function rowPressure_Pa(
	r: ReadingRow,
	row: number,
	problems: ProblemList
): number | undefined {
	const column =
		r.manometer_inclination_deg !== undefined || r.manometer_fluid_density !== undefined;
	const unit = r.unit!;
	if (column && !isLength(unit)) {
		problems.add(
			row,
			'unit',
			`is ${unit}, but a manometer column is read as a length: use ${COLUMN_LENGTH_UNITS.join(', ')}`
		);
		return undefined;
	}
	if (!column && !isPressure(unit)) {
		problems.add(
			row,
			'unit',
			`is a length: give manometer_inclination_deg or manometer_fluid_density for a column reading, or use a pressure unit`
		);
		return undefined;
	}
	const p = column
		? manometerPressure({
				height_m: toSI(r.reading!, unit, 'm'),
				fluidDensity_kgm3: r.manometer_fluid_density,
				inclination_deg: r.manometer_inclination_deg
			})
		: toSI(r.reading!, unit, 'Pa');
	const [absMin, absMax] = PHYSICAL_RANGES.absolute_Pa;
	const gauge = PHYSICAL_RANGES.gauge_Pa;
	if (r.kind === 'absolute' ? p < absMin || p > absMax : Math.abs(p) > gauge) {
		problems.add(
			row,
			'reading',
			r.kind === 'absolute'
				? `${pascalText(p)} is outside the physical range of an absolute pressure (${absMin / 1000}–${absMax / 1000} kPa)`
				: `${pascalText(p)} is outside the physical range of a ${r.kind} reading (±${gauge / 1000} kPa against the free stream)`
		);
		return undefined;
	}
	return p;
}
