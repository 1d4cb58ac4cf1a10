import { requireRole } from '$lib/server/guards';
import { reviewQueue } from '$lib/server/review';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requireRole(locals, 'reviewer', 'admin');
	return { queue: reviewQueue(locals.db, user) };
};
