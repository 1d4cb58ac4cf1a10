import { canEditFacilities } from '$lib/server/access';
import { listFacilities } from '$lib/server/facilities';
import { requireUser } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requireUser(locals);
	return { facilities: listFacilities(locals.db), canEdit: canEditFacilities(user) };
};
