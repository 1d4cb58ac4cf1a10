import { json } from '@sveltejs/kit';
import { apiTokenSchema } from '$lib/schemas/api-token';
import { readJson, refusalResponse } from '$lib/server/api';
import { createApiToken, listApiTokens } from '$lib/server/api-tokens';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	const user = requireUser(locals);
	return json({ tokens: listApiTokens(locals.db, user) });
};

export const POST: RequestHandler = async (event) => {
	const user = requireUser(event.locals);
	const body = await readJson(event, apiTokenSchema);
	if (!body.ok) return body.response;
	const created = createApiToken(event.locals.db, user, body.data);
	if (!created.ok) return refusalResponse(created);
	const { id, name, scopes, expiresAt, token } = created;
	return json({ id, name, scopes, expiresAt, token }, { status: 201 });
};
