import { error, json } from '@sveltejs/kit';
import { quoteDecisionSchema } from '$lib/schemas/billing';
import { readJson, refusalResponse } from '$lib/server/api';
import { actsForClient } from '$lib/server/access';
import { decideQuote, getQuote, quoteResource } from '$lib/server/billing';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

/** The client team's answer: `{ "decision": "accept" | "decline", "note": "…" }`. */
export const POST: RequestHandler = async (event) => {
	const user = requireUser(event.locals);
	const q = getQuote(event.locals.db, user, event.params.id);
	if (!q) error(404, { message: 'No such quote.' });
	if (!actsForClient(user, q))
		error(403, { message: 'Only the client team accepts or declines a quote.' });
	const body = await readJson(event, quoteDecisionSchema);
	if (!body.ok) return body.response;
	const decided = decideQuote(event.locals.db, user, event.params.id, body.data, event.url.origin);
	return decided.ok ? json(quoteResource(decided.quote)) : refusalResponse(decided);
};
