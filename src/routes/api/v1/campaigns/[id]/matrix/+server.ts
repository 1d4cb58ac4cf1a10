import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { MAX_MATRIX_POINTS, matrixRows, matrixSize } from '$lib/calc';
import { apiError, calculationResponse, fieldMessages } from '$lib/server/api';
import { figuresOf } from '$lib/server/campaign-export';
import { getCampaignFor } from '$lib/server/campaigns';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

const pageQuery = z.object({
	offset: z.coerce.number().int().min(0).max(MAX_MATRIX_POINTS).default(0),
	limit: z.coerce.number().int().min(1).max(5000).default(500)
});

/** The campaign's matrix rows with their derived quantities, a page at a time. */
export const GET: RequestHandler = ({ locals, params, url }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	const page = pageQuery.safeParse(Object.fromEntries(url.searchParams));
	if (!page.success)
		return apiError(400, 'invalid', 'Bad paging parameters.', fieldMessages(page.error));
	const { offset, limit } = page.data;
	return calculationResponse(() => {
		const { plan } = figuresOf(found);
		return { rowCount: matrixSize(plan), offset, limit, rows: matrixRows(plan, offset, limit) };
	});
};
