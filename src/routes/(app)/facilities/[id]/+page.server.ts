import { error } from '@sveltejs/kit';
import { canEditFacilities } from '$lib/server/access';
import { getFacility } from '$lib/server/facilities';
import { requireUser } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => {
	const user = requireUser(locals);
	const facility = getFacility(locals.db, params.id);
	if (!facility) error(404, { message: 'No such facility.' });
	return { facility, canEdit: canEditFacilities(user) };
};
