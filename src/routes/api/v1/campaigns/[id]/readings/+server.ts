import { error, json } from '@sveltejs/kit';
import { z } from 'zod';
import { READINGS_MAX_BYTES } from '$lib/schemas/readings';
import { apiError, fieldMessages, readBody, refusalResponse, tooLarge } from '$lib/server/api';
import { canUploadReadings } from '$lib/server/access';
import { getCampaignFor } from '$lib/server/campaigns';
import { requireUser } from '$lib/server/guards';
import {
	readingsListing,
	readingsOverview,
	receiveReadings,
	type ReceiveProgress
} from '$lib/server/readings';
import {
	declaredMediaType,
	progressStream,
	readingsRefusalAnswer,
	sentFileName,
	type ApiAnswer
} from '$lib/server/readings/api-answer';
import type { RequestHandler } from './$types';

const pageQuery = z.object({
	offset: z.coerce.number().int().min(0).max(10_000_000).default(0),
	limit: z.coerce.number().int().min(1).max(5000).default(1000)
});

/** The current readings of the approved revision, a page at a time, with coverage. */
export const GET: RequestHandler = ({ locals, params, url }) => {
	const user = requireUser(locals);
	if (!getCampaignFor(locals.db, user, params.id)) error(404, { message: 'No such campaign.' });
	const page = pageQuery.safeParse(Object.fromEntries(url.searchParams));
	if (!page.success)
		return apiError(400, 'invalid', 'Bad paging parameters.', fieldMessages(page.error));
	const listing = readingsListing(locals.db, user, params.id, page.data);
	if (!listing.ok) return refusalResponse(listing);
	const { ok: _, ...body } = listing;
	return json(body);
};

/**
 * Takes a readings file (CSV, or JSON with the same fields) for the approved revision. With
 * `Accept: application/x-ndjson` the answer streams progress lines and ends with the result,
 * which the upload page shows as it goes.
 */
export const POST: RequestHandler = async ({ locals, params, request, url }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	if (!canUploadReadings(user, found))
		return apiError(403, 'forbidden', 'You cannot send readings for this campaign.');
	const mediaType = declaredMediaType(request.headers.get('content-type'));
	if (!mediaType)
		return apiError(
			415,
			'unsupported-media-type',
			'Send the readings as text/csv or application/json.'
		);
	const bytes = await readBody(request, READINGS_MAX_BYTES);
	if (!bytes) return tooLarge(READINGS_MAX_BYTES);
	const file = {
		fileName: sentFileName(request.headers.get('x-file-name'), mediaType),
		mediaType,
		bytes,
		channel: locals.apiToken ? ('api' as const) : ('page' as const)
	};
	const replace = ['true', '1'].includes(url.searchParams.get('replace') ?? '');
	const run = async (progress?: ReceiveProgress): Promise<ApiAnswer> => {
		const outcome = await receiveReadings(locals.db, locals.files, user, params.id, file, {
			replace,
			progress
		});
		if (!outcome.ok) return readingsRefusalAnswer(outcome);
		const { ok: _, ...upload } = outcome;
		return {
			status: 201,
			body: { upload, coverage: readingsOverview(locals.db, user, params.id)?.coverage ?? null }
		};
	};

	if (!(request.headers.get('accept') ?? '').includes('application/x-ndjson')) {
		const { status, body } = await run();
		return json(body, { status });
	}
	return progressStream(run);
};
