import { error, fail, redirect } from '@sveltejs/kit';
import { creditNoteSchema } from '$lib/schemas/billing';
import { actsForClient, can } from '$lib/server/access';
import { creditInvoice, getInvoice, invoiceView } from '$lib/server/billing';
import { requirePermission, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import { startCheckout } from '$lib/server/payments';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params, url }) => {
	const user = requireUser(locals);
	const found = getInvoice(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such invoice.' });
	const view = invoiceView(locals.db, found);
	const payable = view.status === 'open' && Number(view.total) > 0;
	return {
		invoice: view,
		canPay: payable && actsForClient(user, found),
		canCredit: can(user, 'manage-billing') && view.kind === 'invoice' && !view.creditedBy,
		returnedFromPayment: url.searchParams.get('payment')
	};
};

export const actions: Actions = {
	pay: async ({ locals, params, url }) => {
		const user = requireUser(locals);
		const found = getInvoice(locals.db, user, params.id);
		if (!found) error(404, { message: 'No such invoice.' });
		if (!actsForClient(user, found))
			return fail(403, { billingError: 'Only the client team pays its invoices.' });
		const back = `${url.origin}/invoices/${found.id}`;
		const checkout = await startCheckout(locals.db, found, {
			successUrl: `${back}?payment=done`,
			cancelUrl: `${back}?payment=cancelled`
		});
		if (!checkout.ok)
			return fail(STATUS_OF_REFUSAL[checkout.code], { billingError: checkout.message });
		redirect(303, checkout.url);
	},
	credit: async ({ locals, params, request, url }) => {
		const user = requirePermission(locals, 'manage-billing');
		if (!getInvoice(locals.db, user, params.id)) error(404, { message: 'No such invoice.' });
		const form = await request.formData().catch(() => null);
		const parsed = creditNoteSchema.safeParse({ reason: form?.get('reason') ?? '' });
		if (!parsed.success)
			return fail(400, { billingError: parsed.error.issues[0]?.message ?? 'Say why.' });
		const credited = creditInvoice(locals.db, user, params.id, parsed.data.reason, url.origin);
		if (!credited.ok)
			return fail(STATUS_OF_REFUSAL[credited.code], { billingError: credited.message });
		redirect(303, `/invoices/${credited.invoice.id}`);
	}
};
