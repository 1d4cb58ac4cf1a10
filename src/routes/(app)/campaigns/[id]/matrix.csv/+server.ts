import { error, text } from '@sveltejs/kit';
import { figuresOrProblem, matrixCsv } from '$lib/server/campaign-export';
import { getCampaignFor } from '$lib/server/campaigns';
import { csvDownload } from '$lib/server/csv-download';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	const { figures, problem } = figuresOrProblem(found);
	if (!figures) return text(problem, { status: 409 });
	return csvDownload(matrixCsv(figures), found.name, 'matrix.csv');
};
