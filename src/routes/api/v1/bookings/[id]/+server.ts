import { json } from '@sveltejs/kit';
import { bookingChangeSchema } from '$lib/schemas/booking';
import { readJson, refusalResponse } from '$lib/server/api';
import { changeBooking } from '$lib/server/bookings';
import { requireRole } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'operator', 'admin');
	const body = await readJson(event, bookingChangeSchema);
	if (!body.ok) return body.response;
	const changed = changeBooking(
		event.locals.db,
		user,
		event.params.id,
		body.data,
		event.url.origin
	);
	return changed.ok ? json({ id: event.params.id }) : refusalResponse(changed);
};

export const DELETE: RequestHandler = ({ locals, params, url }) => {
	const user = requireRole(locals, 'operator', 'admin');
	const cancelled = changeBooking(locals.db, user, params.id, { state: 'cancelled' }, url.origin);
	return cancelled.ok ? new Response(null, { status: 204 }) : refusalResponse(cancelled);
};
