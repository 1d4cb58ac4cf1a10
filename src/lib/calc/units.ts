import convertUnits from 'convert-units';
import { CalcInputError, requireFinite } from './errors';

/**
 * Pressure units convert-units lacks, in pascals (NIST SP 811, Appendix B.8): conventional
 * millimetre and inch of water (ρ = 1000 kg/m³, g = 9.80665 m/s²), conventional mmHg, and the
 * millibar (exactly 100 Pa).
 */
const EXTRA_PRESSURE_UNITS_PA: Record<string, number> = {
	mmH2O: 9.80665,
	inH2O: 249.0889,
	mmHg: 133.3224,
	mbar: 100
};

/** The pressure units manometer banks, scanners and barometers report in. */
export const READING_PRESSURE_UNITS = [
	'Pa',
	'kPa',
	'hPa',
	'mbar',
	'mmH2O',
	'inH2O',
	'mmHg',
	'psi'
] as const;

/** Units a manometer's column length may be read in. */
export const COLUMN_LENGTH_UNITS = ['mm', 'cm', 'm', 'in'] as const;

const catalogue = convertUnits();

function measureOf(unit: string, parameter: 'from' | 'to'): string {
	if (unit in EXTRA_PRESSURE_UNITS_PA) return 'pressure';
	try {
		return catalogue.describe(unit as never).measure;
	} catch {
		throw new CalcInputError(
			parameter,
			unit,
			`a known unit, such as ${knownUnits().slice(0, 12).join(', ')}, …`
		);
	}
}

export function knownUnits(measure?: string): string[] {
	const base = (
		measure ? catalogue.possibilities(measure as never) : catalogue.possibilities()
	) as string[];
	return !measure || measure === 'pressure'
		? [...base, ...Object.keys(EXTRA_PRESSURE_UNITS_PA)]
		: base;
}

/** Converts between convert-units' symbols plus mmH2O, inH2O and mmHg. */
export function convertUnit(value: number, from: string, to: string): number {
	const result = convertFinite(value, from, to);
	if (!Number.isFinite(result)) {
		throw new CalcInputError('value', value, `small enough to express in ${to}`);
	}
	return result;
}

function convertFinite(value: number, from: string, to: string): number {
	requireFinite('value', value);
	const fromMeasure = measureOf(from, 'from');
	const toMeasure = measureOf(to, 'to');
	if (fromMeasure !== toMeasure) {
		throw new CalcInputError('to', to, `a unit of ${fromMeasure}, like ${from}`);
	}
	if (from === to) return value;
	if (
		fromMeasure === 'pressure' &&
		(from in EXTRA_PRESSURE_UNITS_PA || to in EXTRA_PRESSURE_UNITS_PA)
	) {
		const pascals =
			from in EXTRA_PRESSURE_UNITS_PA
				? value * EXTRA_PRESSURE_UNITS_PA[from]!
				: convertUnits(value)
						.from(from as never)
						.to('Pa');
		return to in EXTRA_PRESSURE_UNITS_PA
			? pascals / EXTRA_PRESSURE_UNITS_PA[to]!
			: convertUnits(pascals)
					.from('Pa')
					.to(to as never);
	}
	return convertUnits(value)
		.from(from as never)
		.to(to as never);
}

/** Pa → conventional mm of water, the manometer reading. */
export function pascalsToMmH2O(pressure_Pa: number): number {
	return pressure_Pa / EXTRA_PRESSURE_UNITS_PA.mmH2O!;
}
