import { CalcInputError } from '../calc';
import { campaignDefinitionSchema } from '../schemas/campaign';
import { campaignFigures, type CampaignFigures, type CostedFacility } from './figures';
import type { PlanModel } from './plan';

/** The editor's figures for the form as it stands. */
export type LiveFigures =
	| { state: 'unchosen' }
	| { state: 'problem'; problem: string }
	| { state: 'ready'; figures: CampaignFigures };

/**
 * The stored figures' own computation on the form's current values: a value the form's schema
 * refuses, or one the core refuses, is the problem shown instead of figures.
 */
export function liveFigures(
	form: unknown,
	model: PlanModel | undefined,
	facility: CostedFacility | undefined
): LiveFigures {
	if (!model || !facility) return { state: 'unchosen' };
	const parsed = campaignDefinitionSchema.safeParse(form);
	if (!parsed.success) {
		const issue = parsed.error.issues[0]!;
		return { state: 'problem', problem: `Check the form: ${issue.message}` };
	}
	try {
		return { state: 'ready', figures: campaignFigures(parsed.data, model, facility) };
	} catch (error) {
		if (error instanceof CalcInputError) return { state: 'problem', problem: error.message };
		throw error;
	}
}
