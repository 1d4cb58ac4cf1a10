import { error } from '@sveltejs/kit';
import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { campaignSchema } from '$lib/schemas/campaign';
import { canEditCampaign } from '$lib/server/access';
import { saveCampaignForm } from '$lib/server/campaign-form';
import {
	campaignInput,
	editableCampaign,
	getCampaignFor,
	updateCampaign
} from '$lib/server/campaigns';
import { listFacilities } from '$lib/server/facilities';
import { withBaseVersion } from '$lib/server/form-versions';
import { requireRole } from '$lib/server/guards';
import { returnNotes } from '$lib/server/review';
import { listModelsFor } from '$lib/server/models';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist');
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	if (!canEditCampaign(user, found)) error(403, { message: 'Only the owner can change a draft.' });
	return {
		id: found.id,
		name: found.name,
		models: listModelsFor(locals.db, user).filter((m) => m.teamId === found.teamId),
		facilities: listFacilities(locals.db),
		review: returnNotes(locals.db, user, found.id),
		version: found.version,
		form: await superValidate(campaignInput(found), zod4(campaignSchema))
	};
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireRole(event.locals, 'aerodynamicist');
		const editable = editableCampaign(event.locals.db, user, event.params.id);
		if (!editable.ok) error(STATUS_OF_REFUSAL[editable.code], { message: editable.message });
		return saveCampaignForm(
			event,
			(input, base) =>
				withBaseVersion(base, (version) =>
					updateCampaign(event.locals.db, user, event.params.id, input, version)
				),
			() => `/campaigns/${event.params.id}`
		);
	}
};
