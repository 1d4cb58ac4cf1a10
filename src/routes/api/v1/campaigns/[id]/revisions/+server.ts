import { error, json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import { listRevisions } from '$lib/server/review';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const revisions = listRevisions(locals.db, user, params.id);
	if (!revisions) error(404, { message: 'No such campaign.' });
	return json({ revisions });
};
