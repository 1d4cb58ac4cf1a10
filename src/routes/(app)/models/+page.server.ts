import { requireRole } from '$lib/server/guards';
import { listModelsFor } from '$lib/server/models';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requireRole(locals, 'aerodynamicist', 'admin');
	return { models: listModelsFor(locals.db, user) };
};
