import { error, json } from '@sveltejs/kit';
import { invoiceQuerySchema, invoiceRequestSchema } from '$lib/schemas/billing';
import { apiError, fieldMessages, readJson, refusalResponse } from '$lib/server/api';
import { can } from '$lib/server/access';
import { invoiceView, issueInvoice, listInvoices } from '$lib/server/billing';
import { requirePermission, requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, url }) => {
	const user = requireUser(locals);
	if (!can(user, 'manage-billing') && !user.roles.includes('aerodynamicist'))
		error(403, { message: 'Invoices are for the facility’s staff and its client teams.' });
	const query = invoiceQuerySchema.safeParse(Object.fromEntries(url.searchParams));
	if (!query.success) return apiError(400, 'invalid', 'Bad filter.', fieldMessages(query.error));
	const page = listInvoices(locals.db, user, query.data);
	if (!page.ok) return refusalResponse(page);
	return json({ invoices: page.invoices, next: page.next });
};

/** Invoices the campaign's completed slots not yet billed: `{ "campaignId": "…" }`. */
export const POST: RequestHandler = async (event) => {
	const user = requirePermission(event.locals, 'manage-billing');
	const body = await readJson(event, invoiceRequestSchema);
	if (!body.ok) return body.response;
	const issued = issueInvoice(event.locals.db, user, body.data.campaignId, event.url.origin);
	if (!issued.ok) return refusalResponse(issued);
	return json(invoiceView(event.locals.db, issued.invoice), {
		status: 201,
		headers: { location: `/api/v1/invoices/${issued.invoice.id}` }
	});
};
