import { json } from '@sveltejs/kit';
import { scaleModelSchema } from '$lib/schemas/model';
import { readJson, refusalResponse } from '$lib/server/api';
import { requireRole } from '$lib/server/guards';
import { createModel, listModelsFor } from '$lib/server/models';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	const user = requireRole(locals, 'aerodynamicist', 'admin');
	return json({ models: listModelsFor(locals.db, user) });
};

export const POST: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'aerodynamicist');
	const body = await readJson(event, scaleModelSchema);
	if (!body.ok) return body.response;
	const created = createModel(event.locals.db, user, body.data);
	return created.ok ? json({ id: created.id }, { status: 201 }) : refusalResponse(created);
};
