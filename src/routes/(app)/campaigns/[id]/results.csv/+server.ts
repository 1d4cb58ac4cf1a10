import { csvDownload } from '$lib/server/csv-download';
import { requireUser } from '$lib/server/guards';
import { resultsCsv } from '$lib/server/results-export';
import { resultsPageData } from '$lib/server/results-page';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params, url }) => {
	const data = resultsPageData(locals.db, requireUser(locals), params.id, url);
	return csvDownload(
		resultsCsv(data.results),
		data.campaign.name,
		`r${data.results.revision}-results.csv`
	);
};
