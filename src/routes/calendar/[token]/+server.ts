import { error } from '@sveltejs/kit';
import { feedCalendar, feedOwner } from '$lib/server/feeds';
import type { RequestHandler } from './$types';

/** The user's slots as a subscribable calendar; the secret in the address is the only key. */
export const GET: RequestHandler = ({ locals, params, url }) => {
	const owner = feedOwner(locals.db, params.token.replace(/\.ics$/, ''));
	if (!owner) error(404, { message: 'No such calendar feed.' });
	const facilityId = url.searchParams.get('facility') ?? undefined;
	return new Response(feedCalendar(locals.db, owner, url.origin, facilityId), {
		headers: {
			'content-type': 'text/calendar; charset=utf-8',
			'cache-control': 'private, max-age=300'
		}
	});
};
