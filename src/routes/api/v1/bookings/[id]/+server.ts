import { bookingChangeSchema } from '$lib/schemas/booking';
import { readJson, refusalResponse } from '$lib/server/api';
import { changeBooking, findBookingFor } from '$lib/server/bookings';
import { requirePermission } from '$lib/server/guards';
import { expectedVersion, versionedJson } from '$lib/server/preconditions';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = async (event) => {
	const user = requirePermission(event.locals, 'book-tunnel-time');
	const found = findBookingFor(event.locals.db, user, event.params.id);
	if (!found.ok) return refusalResponse(found);
	const expected = expectedVersion(event.request);
	if (!expected.ok) return expected.response;
	const body = await readJson(event, bookingChangeSchema);
	if (!body.ok) return body.response;
	const changed = changeBooking(
		event.locals.db,
		user,
		event.params.id,
		body.data,
		expected.base,
		event.url.origin
	);
	return changed.ok
		? versionedJson({ id: event.params.id, version: changed.version }, changed.version)
		: refusalResponse(changed);
};

export const DELETE: RequestHandler = ({ locals, params, url }) => {
	const user = requirePermission(locals, 'book-tunnel-time');
	// Cancelling is a deliberate end whatever was changed before; the state table still rules.
	const cancelled = changeBooking(
		locals.db,
		user,
		params.id,
		{ state: 'cancelled' },
		'any',
		url.origin
	);
	return cancelled.ok ? new Response(null, { status: 204 }) : refusalResponse(cancelled);
};
