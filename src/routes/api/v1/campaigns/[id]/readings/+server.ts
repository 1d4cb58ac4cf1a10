import { error, json } from '@sveltejs/kit';
import { z } from 'zod';
import { READINGS_MAX_BYTES } from '$lib/schemas/readings';
import { apiError, fieldMessages, readBody, refusalResponse, tooLarge } from '$lib/server/api';
import { attachmentStore } from '$lib/server/attachments';
import { canUploadReadings } from '$lib/server/access';
import { getCampaignFor } from '$lib/server/campaigns';
import { requireUser } from '$lib/server/guards';
import {
	readingsListing,
	readingsOverview,
	receiveReadings,
	type ReadingsRefusal,
	type ReceivePhase
} from '$lib/server/readings';
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

const MEDIA_TYPES = {
	'text/csv': 'text/csv',
	'text/plain': 'text/csv',
	'application/json': 'application/json'
} as const;

function refusalBody(refusal: ReadingsRefusal): { status: number; body: unknown } {
	const response = refusalResponse(refusal);
	const { ok: _, code, message, field: __, ...details } = refusal;
	return {
		status: response.status,
		body: { error: { code: code === 'invalid' ? 'invalid-readings' : code, message, ...details } }
	};
}

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
	const declared = (request.headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();
	const mediaType = MEDIA_TYPES[declared as keyof typeof MEDIA_TYPES];
	if (!mediaType)
		return apiError(
			415,
			'unsupported-media-type',
			'Send the readings as text/csv or application/json.'
		);
	const bytes = await readBody(request, READINGS_MAX_BYTES);
	if (!bytes) return tooLarge(READINGS_MAX_BYTES);
	const named = decodeURIComponent(request.headers.get('x-file-name') ?? '').trim();
	const file = {
		fileName: (named || (mediaType === 'text/csv' ? 'readings.csv' : 'readings.json')).slice(
			0,
			200
		),
		mediaType,
		bytes,
		channel: locals.apiToken ? ('api' as const) : ('page' as const)
	};
	const replace = ['true', '1'].includes(url.searchParams.get('replace') ?? '');
	const run = async (progress?: (phase: ReceivePhase, done: number, total: number) => void) => {
		const outcome = await receiveReadings(locals.db, attachmentStore(), user, params.id, file, {
			replace,
			progress
		});
		if (!outcome.ok) return refusalBody(outcome);
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
	const encoder = new TextEncoder();
	const stream = new ReadableStream({
		async start(controller) {
			const send = (line: unknown) =>
				controller.enqueue(encoder.encode(JSON.stringify(line) + '\n'));
			try {
				send({
					type: 'result',
					...(await run((phase, done, total) => send({ type: 'progress', phase, done, total })))
				});
			} catch (error) {
				console.error(error);
				send({
					type: 'result',
					status: 500,
					body: { error: { code: 'server-error', message: 'Something went wrong on the server.' } }
				});
			}
			controller.close();
		}
	});
	return new Response(stream, {
		headers: { 'content-type': 'application/x-ndjson', 'cache-control': 'no-store' }
	});
};
