import { z } from 'zod';
import { COLUMN_LENGTH_UNITS, READING_PRESSURE_UNITS } from '../calc/units';

/** What a probe reading measures: p − p∞, p0 − p∞, or an absolute pressure. */
export const READING_KINDS = ['static', 'total', 'absolute'] as const;
export type ReadingKind = (typeof READING_KINDS)[number];

/** Largest readings file or JSON body taken in one upload. */
export const READINGS_MAX_BYTES = 24 * 1024 * 1024;
/** Most readings in one upload: every point of the largest matrix, one kind each. */
export const READINGS_MAX_ROWS = 300_000;

/**
 * The columns of a readings file, and the fields of a JSON reading, in the order the template
 * writes them. Names are matched case-insensitively. The identifying columns from configuration
 * to z_m are optional; when present they are checked against the point, so a shuffled or
 * mislabelled file is caught.
 */
export const READING_COLUMNS = [
	'point',
	'run',
	'configuration',
	'yaw_deg',
	'speed_mps',
	'plane',
	'repeat',
	'row',
	'column',
	'y_m',
	'z_m',
	'kind',
	'reading',
	'unit',
	'reference_dynamic_pressure',
	'reference_unit',
	'air_temperature_c',
	'barometric_pressure',
	'barometric_unit',
	'relative_humidity',
	'manometer_inclination_deg',
	'manometer_fluid_density',
	'time',
	'note'
] as const;
export type ReadingColumn = (typeof READING_COLUMNS)[number];

/** Columns every file must have, besides a point identifier. */
export const REQUIRED_READING_COLUMNS: readonly ReadingColumn[] = [
	'kind',
	'reading',
	'unit',
	'reference_dynamic_pressure',
	'reference_unit',
	'air_temperature_c',
	'barometric_pressure',
	'barometric_unit'
];

const blank = (v: unknown) =>
	v === undefined || v === null || (typeof v === 'string' && v.trim() === '');

/** A number from a JSON number or a CSV cell; an empty cell is "not given". */
const numberCell = z.preprocess(
	(v) => {
		if (blank(v)) return undefined;
		if (typeof v !== 'string') return v;
		const n = Number(v.trim());
		return Number.isNaN(n) ? v : n;
	},
	z
		.number({ error: (issue) => (issue.input === undefined ? 'is required' : 'is not a number') })
		.finite({ error: 'is not a finite number' })
		.optional()
);

const wholeCell = numberCell.refine((v) => v === undefined || (Number.isInteger(v) && v >= 1), {
	error: 'is not a whole number of 1 or more'
});

const textCell = (max: number) =>
	z.preprocess(
		(v) => (blank(v) ? undefined : typeof v === 'number' ? String(v) : v),
		z
			.string({ error: 'is not text' })
			.trim()
			.max(max, { error: `is longer than ${max} characters` })
			.optional()
	);

/** Unit symbols are matched without regard to case: none of the accepted ones differ only by case. */
const unitCell = <const U extends readonly string[]>(units: U, what: string) => {
	const byLower = new Map(units.map((u) => [u.toLowerCase(), u]));
	return z.preprocess(
		(v) =>
			blank(v) ? undefined : typeof v === 'string' ? (byLower.get(v.trim().toLowerCase()) ?? v) : v,
		z
			.enum(units as unknown as [U[number], ...U[number][]], {
				error: (issue) =>
					issue.input === undefined ? 'is required' : `is not ${what}: use ${units.join(', ')}`
			})
			.optional()
	);
};

const PRESSURE_AND_LENGTH_UNITS = [...READING_PRESSURE_UNITS, ...COLUMN_LENGTH_UNITS] as const;

/** Relative humidity as a fraction; values above 1 up to 100, or with a % sign, are percent. */
const humidityCell = z.preprocess(
	(v) => {
		if (blank(v)) return undefined;
		const text = typeof v === 'string' ? v.trim() : null;
		const percent = text?.endsWith('%') ?? false;
		const n = text === null ? v : Number((percent ? text.slice(0, -1) : text).trim());
		if (typeof n !== 'number' || Number.isNaN(n)) return v;
		return percent || n > 1 ? n / 100 : n;
	},
	z
		.number({ error: 'is not a number' })
		.min(0, { error: 'is below 0 %' })
		.max(1, { error: 'is above 100 %' })
		.optional()
);

const instantCell = z.preprocess(
	(v) => (blank(v) ? undefined : v),
	z.iso
		.datetime({ offset: true, local: true, error: 'is not an ISO 8601 date and time' })
		.or(z.iso.date({ error: 'is not an ISO 8601 date and time' }))
		.optional()
);

/**
 * One reading as a row of the file or an item of the JSON body; one schema for both. Ranges
 * that depend on the unit (pressures, temperatures) are checked after conversion to SI.
 */
export const readingRowSchema = z
	.object({
		point: wholeCell,
		run: wholeCell,
		row: wholeCell,
		column: wholeCell,
		configuration: textCell(64),
		plane: textCell(64),
		yaw_deg: numberCell,
		speed_mps: numberCell,
		repeat: wholeCell,
		y_m: numberCell,
		z_m: numberCell,
		kind: z.preprocess(
			(v) => (blank(v) ? undefined : typeof v === 'string' ? v.trim().toLowerCase() : v),
			z.enum(READING_KINDS, {
				error: (issue) =>
					issue.input === undefined ? 'is required' : `is not one of ${READING_KINDS.join(', ')}`
			})
		),
		reading: numberCell.refine((v) => v !== undefined, { error: 'is required' }),
		unit: unitCell(
			PRESSURE_AND_LENGTH_UNITS,
			'a pressure unit (or a length, for a manometer column)'
		).refine((v) => v !== undefined, { error: 'is required' }),
		reference_dynamic_pressure: numberCell,
		reference_unit: unitCell(READING_PRESSURE_UNITS, 'a pressure unit'),
		air_temperature_c: numberCell,
		barometric_pressure: numberCell,
		barometric_unit: unitCell(READING_PRESSURE_UNITS, 'a pressure unit'),
		relative_humidity: humidityCell,
		manometer_inclination_deg: numberCell.refine((v) => v === undefined || (v > 0 && v <= 90), {
			error: 'is not an angle above 0° and up to 90° from horizontal'
		}),
		manometer_fluid_density: numberCell.refine(
			(v) => v === undefined || (v >= 500 && v <= 15_000),
			{
				error: 'is not a manometer fluid density between 500 and 15 000 kg/m³'
			}
		),
		time: instantCell,
		note: textCell(500)
	})
	.refine(
		(r) =>
			r.point !== undefined ||
			(r.run !== undefined && r.row !== undefined && r.column !== undefined),
		{
			path: ['point'],
			error: 'is required (or run, row and column together)'
		}
	);

export type ReadingRow = z.output<typeof readingRowSchema>;

/** The JSON body of `POST /api/v1/campaigns/:id/readings`: the rows, bare or under `readings`. */
export const readingsBodySchema = z.union([
	z.array(z.record(z.string(), z.unknown())).max(READINGS_MAX_ROWS),
	z.object({ readings: z.array(z.record(z.string(), z.unknown())).max(READINGS_MAX_ROWS) })
]);
