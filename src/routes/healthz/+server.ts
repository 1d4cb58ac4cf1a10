import { json } from '@sveltejs/kit';
import { databaseReachable } from '$lib/server/health';
import type { RequestHandler } from './$types';

/** Readiness for a deployment's probe: the database answers. Public, and no session is read. */
export const GET: RequestHandler = ({ locals }) => {
	const ready = databaseReachable(locals.db);
	return json(
		{ status: ready ? 'ok' : 'unavailable' },
		{ status: ready ? 200 : 503, headers: { 'cache-control': 'no-store' } }
	);
};
