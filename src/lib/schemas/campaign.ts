import { z } from 'zod';
import { MATRIX_LIST_LIMITS, MAX_MATRIX_POINTS, MAX_POINTS_PER_PLANE } from '../calc/matrix';
import { BLOCKAGE_METHODS } from '../calc/kinds';

export { CAMPAIGN_STATES, type CampaignState } from '../workflow';

export const SPEED_UNITS = ['m/s', 'km/h', 'mph'] as const;
export const DOWNSTREAM_UNITS = ['model-lengths', 'mm'] as const;

const positive = (what: string) =>
	z
		.number({ error: `Enter ${what}.` })
		.positive({ error: `${what[0]!.toUpperCase()}${what.slice(1)} must be above 0.` });
const finite = (what: string) => z.number({ error: `Enter ${what}.` }).refine(Number.isFinite);
const slug = z
	.string()
	.trim()
	.min(1, { error: 'Give it a short id.' })
	.max(40)
	.regex(/^[A-Za-z0-9][\w.-]*$/, { error: 'Letters, digits, dot, dash or underscore.' });

export const airAssumptionSchema = z.discriminatedUnion('model', [
	z.object({
		model: z.literal('isa'),
		siteAltitude_m: z.number().min(-2000).max(6000),
		temperatureOffset_K: z.number().min(-60).max(60)
	}),
	z.object({
		model: z.literal('measured'),
		temperature_K: z.number().min(233.15).max(333.15),
		pressure_Pa: z.number().min(50_000).max(120_000),
		relativeHumidity: z.number().min(0).max(1)
	})
]);

export const probeGridSchema = z.discriminatedUnion('mode', [
	z.object({
		mode: z.literal('uniform'),
		rows: z.number().int().min(1).max(MAX_POINTS_PER_PLANE),
		columns: z.number().int().min(1).max(MAX_POINTS_PER_PLANE),
		rowSpacing_m: positive('the row spacing'),
		columnSpacing_m: positive('the column spacing'),
		firstRow_m: finite('the first row height'),
		firstColumn_m: finite('the first column position')
	}),
	z.object({
		mode: z.literal('explicit'),
		y_m: z
			.array(finite('a row height'))
			.min(1, { error: 'List at least one row height.' })
			.max(MAX_POINTS_PER_PLANE),
		z_m: z
			.array(finite('a column position'))
			.min(1, { error: 'List at least one column position.' })
			.max(MAX_POINTS_PER_PLANE)
	})
]);
export type ProbeGridSpec = z.infer<typeof probeGridSchema>;

export function gridPointCount(grid: ProbeGridSpec): number {
	return grid.mode === 'uniform' ? grid.rows * grid.columns : grid.y_m.length * grid.z_m.length;
}

const planeSchema = z
	.object({
		id: slug,
		label: z.string().trim().max(80),
		downstream: z.object({ value: z.number().min(0), unit: z.enum(DOWNSTREAM_UNITS) }),
		grid: probeGridSchema
	})
	.refine((p) => gridPointCount(p.grid) <= MAX_POINTS_PER_PLANE, {
		path: ['grid'],
		error: `A plane may hold at most ${MAX_POINTS_PER_PLANE.toLocaleString('en-GB')} probe points.`
	});

const configurationSchema = z.object({
	id: slug,
	label: z.string().trim().min(1, { error: 'Name the configuration.' }).max(80),
	description: z.string().trim().max(2000),
	baseline: z.boolean()
});

/** Index of the first value seen before, in one pass (lists come from requests). */
function duplicateIndex<T>(values: T[]): number {
	const seen = new Set<T>();
	return values.findIndex((v) => seen.size === seen.add(v).size);
}

const most = (what: string, limit: number) => ({ error: `At most ${limit} ${what}.` });

/** What a campaign stores as its JSON definition: everything but its identity and links. */
const definitionShape = {
	air: airAssumptionSchema,
	fullScaleSpeed_mps: positive('the full-scale speed'),
	fullScaleAltitude_m: z.number().min(-2000).max(20000),
	reIndependenceThreshold: z.number().positive().nullable(),
	/** Chosen by the owner; until then the default for the model's kind applies. */
	blockageMethod: z.enum(BLOCKAGE_METHODS).optional(),
	speedUnit: z.enum(SPEED_UNITS),
	configurations: z
		.array(configurationSchema)
		.min(1, { error: 'Add at least one configuration.' })
		.max(
			MATRIX_LIST_LIMITS.configurations,
			most('configurations', MATRIX_LIST_LIMITS.configurations)
		),
	speeds_mps: z
		.array(positive('a speed'))
		.min(1, { error: 'Add at least one speed.' })
		.max(MATRIX_LIST_LIMITS.speeds, most('speeds', MATRIX_LIST_LIMITS.speeds)),
	yawAngles_deg: z
		.array(z.number().min(-180).max(180))
		.min(1, { error: 'Add at least one yaw angle.' })
		.max(MATRIX_LIST_LIMITS.yawAngles, most('yaw angles', MATRIX_LIST_LIMITS.yawAngles)),
	planes: z
		.array(planeSchema)
		.min(1, { error: 'Add at least one measurement plane.' })
		.max(MATRIX_LIST_LIMITS.planes, most('planes', MATRIX_LIST_LIMITS.planes)),
	dwellPerPoint_s: z.number().min(0).max(3600),
	repeats: z.number().int().min(1).max(MATRIX_LIST_LIMITS.repeats)
};

function checkDefinition(
	c: z.infer<z.ZodObject<typeof definitionShape>>,
	ctx: z.RefinementCtx
): void {
	const dupSpeed = duplicateIndex(c.speeds_mps);
	if (dupSpeed >= 0)
		ctx.addIssue({
			code: 'custom',
			path: ['speeds_mps'],
			message: `The speed ${c.speeds_mps[dupSpeed]} m/s is listed twice.`
		});
	const dupYaw = duplicateIndex(c.yawAngles_deg);
	if (dupYaw >= 0)
		ctx.addIssue({
			code: 'custom',
			path: ['yawAngles_deg'],
			message: `The yaw angle ${c.yawAngles_deg[dupYaw]}° is listed twice.`
		});
	if (duplicateIndex(c.configurations.map((x) => x.id)) >= 0)
		ctx.addIssue({
			code: 'custom',
			path: ['configurations'],
			message: 'Each configuration needs its own id.'
		});
	if (duplicateIndex(c.planes.map((x) => x.id)) >= 0)
		ctx.addIssue({ code: 'custom', path: ['planes'], message: 'Each plane needs its own id.' });
	if (c.configurations.filter((x) => x.baseline).length !== 1)
		ctx.addIssue({
			code: 'custom',
			path: ['configurations'],
			message: 'Mark exactly one configuration as the baseline.'
		});
	const points = matrixPointCount(c);
	if (points > MAX_MATRIX_POINTS)
		ctx.addIssue({
			code: 'custom',
			path: ['planes'],
			message: `The matrix has ${points.toLocaleString('en-GB')} points; at most ${MAX_MATRIX_POINTS.toLocaleString('en-GB')} are allowed.`
		});
}

/** A campaign's definition alone, as the editor checks it before computing its figures. */
export const campaignDefinitionSchema = z.object(definitionShape).superRefine(checkDefinition);

/** One schema for the campaign form, the JSON API and the database write. */
export const campaignSchema = z
	.object({
		name: z.string().trim().min(1, { error: 'Name the campaign.' }).max(120),
		objective: z.string().trim().max(4000),
		modelId: z.string().min(1, { error: 'Choose a model.' }),
		facilityId: z.string().min(1, { error: 'Choose a facility.' }),
		...definitionShape
	})
	.superRefine(checkDefinition);

export type CampaignInput = z.infer<typeof campaignSchema>;
export type CampaignDefinition = z.infer<typeof campaignDefinitionSchema>;

export function matrixPointCount(
	c: Pick<CampaignInput, 'configurations' | 'speeds_mps' | 'yawAngles_deg' | 'planes' | 'repeats'>
): number {
	const perPass = c.planes.reduce((n, p) => n + gridPointCount(p.grid), 0);
	return (
		c.configurations.length * c.speeds_mps.length * c.yawAngles_deg.length * perPass * c.repeats
	);
}
