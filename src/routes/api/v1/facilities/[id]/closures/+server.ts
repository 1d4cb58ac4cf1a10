import { error, json } from '@sveltejs/kit';
import { closureSchema } from '$lib/schemas/booking';
import { rangeQuery } from '$lib/schemas/range';
import { apiError, fieldMessages, readJson, refusalResponse } from '$lib/server/api';
import { createClosure, listClosures } from '$lib/server/bookings';
import { getFacility } from '$lib/server/facilities';
import { requirePermission, requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params, url }) => {
	requireUser(locals);
	if (!getFacility(locals.db, params.id)) error(404, { message: 'No such facility.' });
	const range = rangeQuery.safeParse(Object.fromEntries(url.searchParams));
	if (!range.success) return apiError(400, 'invalid', 'Bad range.', fieldMessages(range.error));
	return json({ closures: listClosures(locals.db, params.id, range.data.from, range.data.to) });
};

export const POST: RequestHandler = async (event) => {
	const user = requirePermission(event.locals, 'book-tunnel-time');
	if (!getFacility(event.locals.db, event.params.id)) error(404, { message: 'No such facility.' });
	const body = await readJson(event, closureSchema);
	if (!body.ok) return body.response;
	const created = createClosure(event.locals.db, user, event.params.id, body.data);
	return created.ok ? json({ id: created.id }, { status: 201 }) : refusalResponse(created);
};
