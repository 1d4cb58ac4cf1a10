import { error, json } from '@sveltejs/kit';
import { apiError, fieldMessages, refusalResponse } from '$lib/server/api';
import { getCampaignFor } from '$lib/server/campaigns';
import { requireUser } from '$lib/server/guards';
import { campaignResults } from '$lib/server/results';
import { resultsQuery } from '$lib/server/results-page';
import type { RequestHandler } from './$types';

/** Reduced results per plane-run; `?baseline=<configurationId>` sets what differences are against. */
export const GET: RequestHandler = ({ locals, params, url }) => {
	const user = requireUser(locals);
	if (!getCampaignFor(locals.db, user, params.id)) error(404, { message: 'No such campaign.' });
	const query = resultsQuery.safeParse(Object.fromEntries(url.searchParams));
	if (!query.success)
		return apiError(400, 'invalid', 'Bad results parameters.', fieldMessages(query.error));
	const reduced = campaignResults(locals.db, user, params.id, query.data);
	if (!reduced.ok) return refusalResponse(reduced);
	return json(reduced.results);
};
