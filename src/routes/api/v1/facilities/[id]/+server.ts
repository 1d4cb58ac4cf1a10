import { error } from '@sveltejs/kit';
import { facilitySchema } from '$lib/schemas/facility';
import { readJson, refusalResponse } from '$lib/server/api';
import { getFacility, updateFacility } from '$lib/server/facilities';
import { requireRole, requireUser } from '$lib/server/guards';
import { expectedVersion, versionedJson } from '$lib/server/preconditions';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	requireUser(locals);
	const found = getFacility(locals.db, params.id);
	if (!found) error(404, { message: 'No such facility.' });
	return versionedJson({ facility: found }, found.version);
};

export const PUT: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'operator', 'admin');
	if (!getFacility(event.locals.db, event.params.id)) error(404, { message: 'No such facility.' });
	const expected = expectedVersion(event.request);
	if (!expected.ok) return expected.response;
	const body = await readJson(event, facilitySchema);
	if (!body.ok) return body.response;
	const saved = updateFacility(event.locals.db, user, event.params.id, body.data, expected.base);
	return saved.ok
		? versionedJson({ id: event.params.id, version: saved.version }, saved.version)
		: refusalResponse(saved);
};
