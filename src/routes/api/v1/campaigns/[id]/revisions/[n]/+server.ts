import { error, json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import { getRevision } from '$lib/server/review';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const revision = getRevision(locals.db, user, params.id, Number(params.n));
	if (!revision) error(404, { message: 'No such revision.' });
	return json({ revision });
};
