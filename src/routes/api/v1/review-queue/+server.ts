import { json } from '@sveltejs/kit';
import { requirePermission } from '$lib/server/guards';
import { reviewQueue } from '$lib/server/review';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	const user = requirePermission(locals, 'read-review-queue');
	return json({ queue: reviewQueue(locals.db, user) });
};
