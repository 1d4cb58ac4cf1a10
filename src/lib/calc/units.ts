import convertUnits from 'convert-units';
import { CalcInputError, requireFinite } from './errors';

/**
 * Units convert-units lacks or names otherwise, as a factor to the measure's base unit, NIST SP
 * 811 (2008) Appendix B.8 and B.9: conventional millimetre and inch of water (ρ = 1000 kg/m³,
 * g = 9.80665 m/s²), conventional mmHg, the millibar (100 Pa exactly); mile per hour
 * (0.44704 m/s exactly), knot (1852/3600 m/s exactly) and metre per hour. convert-units spells
 * mile per hour `m/h`, which a caller meaning metre per hour would read 1609 times too large,
 * so `m/h` is metre per hour here and `mph` the mile per hour.
 */
const EXTRA_UNITS: Record<string, { measure: 'pressure' | 'speed'; factor: number }> = {
	mmH2O: { measure: 'pressure', factor: 9.80665 },
	inH2O: { measure: 'pressure', factor: 249.0889 },
	mmHg: { measure: 'pressure', factor: 133.3224 },
	mbar: { measure: 'pressure', factor: 100 },
	mph: { measure: 'speed', factor: 0.44704 },
	kn: { measure: 'speed', factor: 1852 / 3600 },
	kt: { measure: 'speed', factor: 1852 / 3600 },
	knot: { measure: 'speed', factor: 1852 / 3600 },
	'm/h': { measure: 'speed', factor: 1 / 3600 }
};
const BASE_UNIT = { pressure: 'Pa', speed: 'm/s' } as const;

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
	const extra = EXTRA_UNITS[unit];
	if (extra) return extra.measure;
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
	const extras = Object.entries(EXTRA_UNITS)
		.filter(([, e]) => !measure || e.measure === measure)
		.map(([unit]) => unit);
	return [...base.filter((u) => !(u in EXTRA_UNITS)), ...extras];
}

/** Converts between convert-units' symbols and the units above (NIST SP 811 factors). */
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
	const fromExtra = EXTRA_UNITS[from];
	const toExtra = EXTRA_UNITS[to];
	if (!fromExtra && !toExtra)
		return convertUnits(value)
			.from(from as never)
			.to(to as never);
	const base = BASE_UNIT[fromMeasure as keyof typeof BASE_UNIT];
	const inBase = fromExtra
		? value * fromExtra.factor
		: convertUnits(value)
				.from(from as never)
				.to(base as never);
	return toExtra
		? inBase / toExtra.factor
		: convertUnits(inBase)
				.from(base as never)
				.to(to as never);
}

/** Pa → conventional mm of water, the manometer reading. */
export function pascalsToMmH2O(pressure_Pa: number): number {
	return pressure_Pa / EXTRA_UNITS.mmH2O!.factor;
}
