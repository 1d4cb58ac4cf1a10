import { requireUser } from '$lib/server/guards';
import { resultsPageData } from '$lib/server/results-page';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params, url }) =>
	resultsPageData(locals.db, requireUser(locals), params.id, url);
