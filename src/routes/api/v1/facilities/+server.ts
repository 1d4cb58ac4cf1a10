import { json } from '@sveltejs/kit';
import { facilitySchema } from '$lib/schemas/facility';
import { readJson, refusalResponse } from '$lib/server/api';
import { createFacility, listFacilities } from '$lib/server/facilities';
import { requireRole, requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	requireUser(locals);
	return json({ facilities: listFacilities(locals.db) });
};

export const POST: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'operator', 'admin');
	const body = await readJson(event, facilitySchema);
	if (!body.ok) return body.response;
	const created = createFacility(event.locals.db, user, body.data);
	return created.ok ? json({ id: created.id }, { status: 201 }) : refusalResponse(created);
};
