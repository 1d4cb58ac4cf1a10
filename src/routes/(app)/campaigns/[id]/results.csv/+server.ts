import { requireUser } from '$lib/server/guards';
import { resultsCsv } from '$lib/server/results-export';
import { resultsPageData } from '$lib/server/results-page';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params, url }) => {
	const data = resultsPageData(locals.db, requireUser(locals), params.id, url);
	const stem = data.campaign.name.replace(/[^\w.-]+/g, '-').replace(/^-|-$/g, '') || 'campaign';
	return new Response(resultsCsv(data.results), {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="${stem}-r${data.results.revision}-results.csv"`
		}
	});
};
