import { listFacilities } from '$lib/server/facilities';
import { requireRole } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	requireRole(locals, 'reviewer', 'admin');
	return { facilities: listFacilities(locals.db) };
};
