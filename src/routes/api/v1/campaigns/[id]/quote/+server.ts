import { error, json } from '@sveltejs/kit';
import { refusalResponse } from '$lib/server/api';
import { campaignQuotes, issueQuote, quoteResource } from '$lib/server/billing';
import { requirePermission, requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

/** The campaign's newest quote, whatever its state. */
export const GET: RequestHandler = ({ locals, params }) => {
	const found = campaignQuotes(locals.db, requireUser(locals), params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	const [current] = found.quotes;
	if (!current) error(404, { message: 'This campaign has no quote yet.' });
	return json(quoteResource(current));
};

export const POST: RequestHandler = ({ locals, params, url }) => {
	const user = requirePermission(locals, 'manage-billing');
	const issued = issueQuote(locals.db, user, params.id, url.origin);
	return issued.ok ? json(quoteResource(issued.quote), { status: 201 }) : refusalResponse(issued);
};
