import { z } from 'zod';
import {
	airState,
	CalcInputError,
	convert,
	isaAtmosphere,
	knownUnits,
	SECTION_KINDS,
	uniformGrid
} from '../calc';

/**
 * Request schemas of the calculation API. A quantity is a bare SI number or
 * `{ "value": 36, "unit": "km/h" }`; each transform hands the calculation core SI values.
 */

/** Runs a core call inside a zod transform, turning its input errors into field issues. */
function viaCore<T>(ctx: z.RefinementCtx, run: () => T): T {
	try {
		return run();
	} catch (error) {
		if (!(error instanceof CalcInputError)) throw error;
		ctx.addIssue({ code: 'custom', message: error.message });
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
			typeof q === 'number' ? q : viaCore(ctx, () => convert(q.value, q.unit, siUnit))
		);
}

const length = quantity('length', 'm');
const speed = quantity('speed', 'm/s');
const area = quantity('area', 'm2');
const volume = quantity('volume', 'm3');
const duration = quantity('time', 's');
const pressure = quantity('pressure', 'Pa');

/** A temperature: convert-units handles the offset between °C, °F and K. */
const temperature = quantity('temperature', 'K');

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
		viaCore(ctx, () =>
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
		z.object({ y: z.array(length).min(1), z: z.array(length).min(1) }),
		z.object({
			rows: z.number().int().min(1),
			columns: z.number().int().min(1),
			rowSpacing: length,
			columnSpacing: length,
			firstRow: length.optional(),
			firstColumn: length.optional()
		})
	])
	.transform((g, ctx) =>
		'y' in g
			? { y_m: g.y, z_m: g.z }
			: viaCore(ctx, () =>
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
		.min(1),
	speeds: z.array(speed).min(1),
	yawAngles_deg: z.array(z.number()).min(1),
	planes: z
		.array(z.object({ id: z.string().min(1).max(80), downstream: length, grid: gridSchema }))
		.min(1),
	dwellPerPoint: duration,
	repeats: z.number().int().min(1).default(1),
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
