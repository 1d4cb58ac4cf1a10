import { error, json } from '@sveltejs/kit';
import { facilitySchema } from '$lib/schemas/facility';
import { readJson, refusalResponse } from '$lib/server/api';
import { getFacility, updateFacility } from '$lib/server/facilities';
import { requireRole, requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	requireUser(locals);
	const found = getFacility(locals.db, params.id);
	if (!found) error(404, { message: 'No such facility.' });
	return json({ facility: found });
};

export const PUT: RequestHandler = async (event) => {
	requireRole(event.locals, 'operator', 'admin');
	if (!getFacility(event.locals.db, event.params.id)) error(404, { message: 'No such facility.' });
	const body = await readJson(event, facilitySchema);
	if (!body.ok) return body.response;
	const saved = updateFacility(event.locals.db, event.params.id, body.data);
	return saved.ok ? json({ id: event.params.id }) : refusalResponse(saved);
};
