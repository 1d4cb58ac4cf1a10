import { requirePermission } from '$lib/server/guards';
import { reviewQueue } from '$lib/server/review';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requirePermission(locals, 'read-review-queue');
	return { queue: reviewQueue(locals.db, user) };
};
