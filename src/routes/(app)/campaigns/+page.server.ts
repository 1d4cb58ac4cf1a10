import { matrixPointCount } from '$lib/schemas/campaign';
import { listCampaignsFor } from '$lib/server/campaigns';
import { requireRole } from '$lib/server/guards';
import { listModelsFor } from '$lib/server/models';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requireRole(locals, 'aerodynamicist', 'reviewer', 'operator', 'admin');
	return {
		campaigns: listCampaignsFor(locals.db, user).map(({ definition, ...c }) => ({
			...c,
			points: matrixPointCount(definition)
		})),
		models: listModelsFor(locals.db, user),
		canDraft: user.roles.includes('aerodynamicist')
	};
};
