import { error, json } from '@sveltejs/kit';
import { getInvoice, invoiceView } from '$lib/server/billing';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const found = getInvoice(locals.db, requireUser(locals), params.id);
	if (!found) error(404, { message: 'No such invoice.' });
	return json(invoiceView(locals.db, found));
};
