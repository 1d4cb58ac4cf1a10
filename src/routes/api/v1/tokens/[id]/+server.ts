import { refusalResponse } from '$lib/server/api';
import { revokeApiToken } from '$lib/server/api-tokens';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const DELETE: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const revoked = revokeApiToken(locals.db, user, params.id);
	return revoked.ok ? new Response(null, { status: 204 }) : refusalResponse(revoked);
};
