import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	const { id, email, name, roles, teams } = requireUser(locals);
	return json({ user: { id, email, name }, roles, teams });
};
