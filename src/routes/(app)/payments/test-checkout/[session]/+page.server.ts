import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import {
	paymentService,
	payTestCheckout,
	testCheckoutCancelUrl,
	testCheckoutView
} from '$lib/server/payments';
import type { Actions, PageServerLoad } from './$types';

// The page stands in for the service's hosted one, which anyone holding the session's
// unguessable address may open; here the payer must also be signed in.

export const load: PageServerLoad = ({ locals, params }) => {
	requireUser(locals);
	const checkout = testCheckoutView(locals.db, paymentService(), params.session);
	if (!checkout) error(404, 'No such checkout.');
	return { checkout };
};

export const actions: Actions = {
	pay: async ({ locals, params, url }) => {
		requireUser(locals);
		const paid = await payTestCheckout(
			locals.db,
			paymentService(),
			params.session,
			`${url.origin}/api/v1/payments/webhook`
		);
		if (!paid.ok && paid.code === 'not-found') error(404, paid.message);
		if (!paid.ok) return fail(STATUS_OF_REFUSAL[paid.code], { notice: paid.message });
		redirect(303, paid.successUrl);
	},

	cancel: ({ locals, params }) => {
		requireUser(locals);
		const back = testCheckoutCancelUrl(locals.db, paymentService(), params.session);
		if (!back) error(404, 'No such checkout.');
		redirect(303, back);
	}
};
