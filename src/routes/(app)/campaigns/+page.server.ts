import { matrixPointCount } from '$lib/schemas/campaign';
import { listCampaignsFor } from '$lib/server/campaigns';
import { can } from '$lib/server/access';
import { requirePermission } from '$lib/server/guards';
import { listModelsFor } from '$lib/server/models';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requirePermission(locals, 'list-campaigns');
	return {
		campaigns: listCampaignsFor(locals.db, user).map(({ definition, ...c }) => ({
			...c,
			points: matrixPointCount(definition)
		})),
		models: listModelsFor(locals.db, user),
		canDraft: can(user, 'draft-campaigns')
	};
};
