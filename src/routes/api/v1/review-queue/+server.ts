import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/guards';
import { reviewQueue } from '$lib/server/review';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	const user = requireRole(locals, 'reviewer', 'admin');
	return json({ queue: reviewQueue(locals.db, user) });
};
