import { z } from 'zod';
import { VERDICTS } from '../workflow';

export const noteAnchorSchema = z.discriminatedUnion('kind', [
	z.object({ kind: z.literal('general') }),
	z.object({ kind: z.literal('configuration'), id: z.string().min(1) }),
	z.object({ kind: z.literal('speed'), speed_mps: z.number().positive() }),
	z.object({ kind: z.literal('yaw'), yaw_deg: z.number() }),
	z.object({ kind: z.literal('plane'), id: z.string().min(1) })
]);

/** One schema for the decision form and POST /api/v1/campaigns/:id/decisions. */
export const decisionSchema = z
	.object({
		revision: z.number().int().min(1),
		verdict: z.enum(VERDICTS),
		summary: z.string().trim().max(4000),
		notes: z
			.array(
				z.object({
					anchor: noteAnchorSchema,
					text: z.string().trim().min(1, { error: 'Write the note or remove it.' }).max(2000)
				})
			)
			.max(100)
	})
	.refine((d) => d.verdict === 'approve' || d.summary.length > 0 || d.notes.length > 0, {
		path: ['summary'],
		error: 'Say what needs to change, or why the campaign is declined.'
	});

export type DecisionInput = z.infer<typeof decisionSchema>;
