import { error, text } from '@sveltejs/kit';
import { figuresOrProblem, matrixCsv } from '$lib/server/campaign-export';
import { getCampaignFor } from '$lib/server/campaigns';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	const { figures, problem } = figuresOrProblem(found);
	if (!figures) return text(problem, { status: 409 });
	const file = `${found.name.replace(/[^\w.-]+/g, '-').replace(/^-|-$/g, '') || 'campaign'}-matrix.csv`;
	return new Response(matrixCsv(figures), {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="${file}"`
		}
	});
};
