import { listFacilities } from '$lib/server/facilities';
import { hasFeed, rotateFeedToken } from '$lib/server/feeds';
import { requireUser } from '$lib/server/guards';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	const user = requireUser(locals);
	return {
		hasFeed: hasFeed(locals.db, user.id),
		facilities: listFacilities(locals.db).map((f) => ({ id: f.id, name: f.name }))
	};
};

export const actions: Actions = {
	// The secret is shown once, right after it is made; only its hash is stored.
	rotate: ({ locals, url }) => {
		const user = requireUser(locals);
		return { feedUrl: `${url.origin}/calendar/${rotateFeedToken(locals.db, user.id)}.ics` };
	}
};
