import { error, redirect } from '@sveltejs/kit';
import { CalcInputError } from '$lib/calc';
import { canEditCampaign } from '$lib/server/access';
import { figuresOf } from '$lib/server/campaign-export';
import { deleteCampaign, getCampaignFor } from '$lib/server/campaigns';
import { requireRole, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	let figures: ReturnType<typeof figuresOf> | null = null;
	let problem: string | null = null;
	try {
		figures = figuresOf(found);
	} catch (thrown) {
		// A facility or model changed since the draft was saved can make it uncomputable.
		if (!(thrown instanceof CalcInputError)) throw thrown;
		problem = thrown.message;
	}
	return { campaign: found, figures, problem, canEdit: canEditCampaign(user, found) };
};

export const actions: Actions = {
	delete: ({ locals, params }) => {
		const user = requireRole(locals, 'aerodynamicist');
		const removed = deleteCampaign(locals.db, user, params.id);
		if (!removed.ok) error(STATUS_OF_REFUSAL[removed.code], { message: removed.message });
		redirect(303, '/campaigns');
	}
};
