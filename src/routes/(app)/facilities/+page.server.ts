import { listFacilities } from '$lib/server/facilities';
import { requireUser } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	requireUser(locals);
	return { facilities: listFacilities(locals.db) };
};
