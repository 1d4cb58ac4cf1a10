import { z } from 'zod';
import {
	airState,
	CalcInputError,
	convert,
	isaAtmosphere,
	knownUnits,
	MATRIX_LIST_LIMITS,
	MAX_POINTS_PER_PLANE,
	SECTION_KINDS,
	BLOCKAGE_METHODS,
	uniformGrid
} from '../calc';

/**
 * Request schemas of the calculation API. A quantity is a bare SI number or
 * `{ "value": 36, "unit": "km/h" }`; each transform hands the calculation core SI values.
 */

/** Unit suffixes of the core's parameter names; the request names the same fields without them. */
const UNIT_SUFFIX = /_(m|mps|Pa|K|s|m2|m3|kgm3|Pas|m2s)(?=$|\.|\[)/g;

/**
 * How a request names the core's parameter: `section.width_m` is `section.width`,
 * `speeds_mps[1]` is `speeds[1]`. Yaw fields keep their `_deg`, as the request spells them.
 */
export function requestFieldOf(parameter: string): string {
	return parameter.replace(UNIT_SUFFIX, '');
}

/**
 * The core's refusal in the request's words. A parameter the request does not have is a figure
 * derived from it: the message says so, in words, instead of naming the core's internals.
 */
export function requestWording(
	error: CalcInputError,
	requestKeys: readonly string[]
): { field: string | null; message: string } {
	const field = requestFieldOf(error.parameter);
	const top = field.split(/[.[]/)[0]!;
	if (requestKeys.includes(top))
		return {
			field,
			message: `${field} = ${String(error.value)} is outside the valid range: ${error.validRange}.`
		};
	const words = field
		.split(/[.[\]]/)
		.filter((part) => part && !/^\d+$/.test(part))
		.at(-1)!
		.replace(/([a-z])([A-Z])/g, '$1 $2')
		.toLowerCase();
	return {
		field: null,
		message: `A figure derived from the request, the ${words}, comes to ${String(error.value)}, outside the valid range: ${error.validRange}.`
	};
}

/** Runs a core call inside a zod transform, turning its input errors into field issues. */
function viaCore<T>(ctx: z.RefinementCtx, keys: readonly string[], run: () => T): T {
	try {
		return run();
	} catch (error) {
		if (!(error instanceof CalcInputError)) throw error;
		const wording = requestWording(error, keys);
		ctx.addIssue({
			code: 'custom',
			message: wording.message,
			...(wording.field ? { path: wording.field.split('.') } : {})
		});
		return z.NEVER;
	}
}

export function quantity(measure: string, siUnit: string) {
	return z
		.union([
			z.number(),
			z.object({
				value: z.number(),
				unit: z.string().refine((u) => knownUnits(measure).includes(u), {
					error: `Use a unit of ${measure}: ${knownUnits(measure).join(', ')}.`
				})
			})
		])
		.transform((q, ctx) =>
			typeof q === 'number' ? q : viaCore(ctx, ['value'], () => convert(q.value, q.unit, siUnit))
		);
}

const length = quantity('length', 'm');
const speed = quantity('speed', 'm/s');
const area = quantity('area', 'm2');
const volume = quantity('volume', 'm3');
const duration = quantity('time', 's');
const pressure = quantity('pressure', 'Pa');

/**
 * A temperature: convert-units handles the offset between °C, °F and K. A bare number is kelvin
 * like every bare quantity; one below 150 is surely meant as °C or °F, so it is refused with
 * the form that says so.
 */
const temperature = quantity('temperature', 'K').refine((t) => t >= 150, {
	error: 'A bare temperature is in kelvin; send { "value": 20, "unit": "C" } for degrees Celsius.'
});

/** A temperature difference: 1 °C of difference is 1 K, 1 °F is 5/9 K. */
const temperatureDifference = z
	.union([z.number(), z.object({ value: z.number(), unit: z.enum(['K', 'C', 'F']) })])
	.transform((q) => (typeof q === 'number' ? q : q.unit === 'F' ? (q.value * 5) / 9 : q.value));

const fraction = z.number().min(0).max(1);

/** Air as the ISA at an altitude (with an optional ± ΔT), or as measured. */
export const airSchema = z
	.discriminatedUnion('model', [
		z.object({
			model: z.literal('isa'),
			geopotentialAltitude: length,
			temperatureOffset: temperatureDifference.optional()
		}),
		z.object({
			model: z.literal('measured'),
			temperature,
			pressure,
			relativeHumidity: fraction.optional(),
			co2MoleFraction: z.number().min(0).max(0.01).optional()
		})
	])
	.transform((air, ctx) =>
		viaCore(ctx, Object.keys(air), () =>
			air.model === 'isa'
				? isaAtmosphere(air.geopotentialAltitude, { temperatureOffset_K: air.temperatureOffset })
				: airState({
						temperature_K: air.temperature,
						pressure_Pa: air.pressure,
						relativeHumidity: air.relativeHumidity,
						co2MoleFraction: air.co2MoleFraction
					})
		)
	);

export const similarityRequestSchema = z.object({
	scale: z.number().gt(0, { error: 'Scale must be above 0, e.g. 0.2 for 1:5.' }).max(1),
	fullScaleLength: length,
	fullScaleSpeed: speed,
	modelSpeed: speed,
	fullScaleAir: airSchema,
	tunnelAir: airSchema,
	reIndependenceThreshold: z.number().positive().optional()
});

const sectionSchema = z.object({
	kind: z.enum(SECTION_KINDS),
	width: length,
	height: length,
	cornerFillet: length.optional()
});

const limitsSchema = z.object({ caution: fraction, limit: fraction });

export const blockageRequestSchema = z.object({
	/** Explicit, with the general estimate when a caller names none; never inferred. */
	method: z.enum(BLOCKAGE_METHODS).default('catch-all'),
	frontalArea: area,
	section: sectionSchema,
	dragCoefficient: z.number().min(0).max(3).optional(),
	modelVolume: volume.optional(),
	modelLength: length.optional(),
	limits: limitsSchema.optional(),
	bodyShapeFactor: z.number().positive().optional(),
	tunnelShapeFactor: z.number().positive().optional()
});

const gridSchema = z
	.union([
		z.object({
			y: z.array(length).min(1).max(MAX_POINTS_PER_PLANE),
			z: z.array(length).min(1).max(MAX_POINTS_PER_PLANE)
		}),
		z.object({
			rows: z.number().int().min(1).max(MAX_POINTS_PER_PLANE),
			columns: z.number().int().min(1).max(MAX_POINTS_PER_PLANE),
			rowSpacing: length,
			columnSpacing: length,
			firstRow: length.optional(),
			firstColumn: length.optional()
		})
	])
	.transform((g, ctx) =>
		'y' in g
			? { y_m: g.y, z_m: g.z }
			: viaCore(ctx, Object.keys(g), () =>
					uniformGrid({
						rows: g.rows,
						columns: g.columns,
						rowSpacing_m: g.rowSpacing,
						columnSpacing_m: g.columnSpacing,
						firstRow_m: g.firstRow,
						firstColumn_m: g.firstColumn
					})
				)
	);

export const MATRIX_PAGE_MAX = 5_000;

export const matrixRequestSchema = z.object({
	configurations: z
		.array(z.object({ id: z.string().min(1).max(80), baseline: z.boolean().optional() }))
		.min(1)
		.max(MATRIX_LIST_LIMITS.configurations),
	speeds: z.array(speed).min(1).max(MATRIX_LIST_LIMITS.speeds),
	yawAngles_deg: z.array(z.number()).min(1).max(MATRIX_LIST_LIMITS.yawAngles),
	planes: z
		.array(z.object({ id: z.string().min(1).max(80), downstream: length, grid: gridSchema }))
		.min(1)
		.max(MATRIX_LIST_LIMITS.planes),
	dwellPerPoint: duration,
	repeats: z.number().int().min(1).max(MATRIX_LIST_LIMITS.repeats).default(1),
	modelReferenceLength: length,
	tunnelAir: airSchema,
	blockage: blockageRequestSchema.optional(),
	envelope: z
		.object({
			minSpeed: speed,
			maxSpeed: speed,
			maxDynamicPressure: pressure,
			yawMin_deg: z.number(),
			yawMax_deg: z.number()
		})
		.optional(),
	timing: z
		.object({
			settling: duration,
			traverseMove: duration,
			yawChange: duration,
			modelChange: duration,
			setUp: duration,
			tearDown: duration
		})
		.optional(),
	offset: z.number().int().min(0).default(0),
	limit: z.number().int().min(0).max(MATRIX_PAGE_MAX).default(500)
});

export type MatrixRequest = z.output<typeof matrixRequestSchema>;
export type BlockageRequest = z.output<typeof blockageRequestSchema>;
