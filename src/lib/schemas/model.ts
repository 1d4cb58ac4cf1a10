import { z } from 'zod';
import { MODEL_KINDS } from '../calc/kinds';

const metres = (what: string) =>
	z
		.number({ error: `Enter the ${what}.` })
		.positive({ error: `The ${what} must be above 0.` })
		.max(10_000);

/** One schema for the model form, the JSON API and the database write; full-scale SI values. */
export const scaleModelSchema = z
	.object({
		teamId: z.string().min(1, { error: 'Choose the team that owns the model.' }),
		name: z.string().trim().min(1, { error: 'Name the model.' }).max(120),
		kind: z.enum(MODEL_KINDS),
		scaleDenominator: z
			.number({ error: 'Enter N of the 1:N scale.' })
			.min(1, { error: 'A scale model is 1:1 or smaller: N is at least 1.' })
			.max(100_000),
		fullScaleLength_m: metres('full-scale length'),
		fullScaleWidth_m: metres('full-scale width'),
		fullScaleHeight_m: metres('full-scale height'),
		fullScaleFrontalArea_m2: z
			.number({ error: 'Enter the frontal area.' })
			.positive({ error: 'The frontal area must be above 0.' }),
		referenceLength_m: metres('reference length'),
		dragCoefficient: z.number().min(0).max(3).nullable(),
		modelVolume_m3: z.number().positive().nullable()
	})
	.refine((m) => m.fullScaleFrontalArea_m2 <= m.fullScaleWidth_m * m.fullScaleHeight_m * 1.0001, {
		path: ['fullScaleFrontalArea_m2'],
		error: 'The frontal area cannot exceed width × height.'
	});

export type ScaleModelInput = z.infer<typeof scaleModelSchema>;

/** A stored model as pages list it, with its owning team's name. */
export type ScaleModelListing = ScaleModelInput & { id: string; teamName: string };

export const ATTACHMENT_MAX_BYTES = 10 * 1024 * 1024;
export const ATTACHMENT_TYPES = [
	'application/pdf',
	'image/png',
	'image/jpeg',
	'image/svg+xml'
] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];
