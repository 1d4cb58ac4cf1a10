import { error, fail, redirect } from '@sveltejs/kit';
import { quoteDecisionSchema } from '$lib/schemas/billing';
import { actsForClient } from '$lib/server/access';
import {
	campaignBilling,
	campaignQuotes,
	decideQuote,
	issueInvoice,
	issueQuote
} from '$lib/server/billing';
import { getCampaignFor } from '$lib/server/campaigns';
import { requirePermission, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => {
	const user = requireUser(locals);
	const c = getCampaignFor(locals.db, user, params.id);
	const billing = c && campaignBilling(locals.db, user, c);
	if (!c || !billing) error(404, { message: 'No such campaign.' });
	return {
		campaign: {
			id: c.id,
			name: c.name,
			state: c.state,
			teamName: c.model.teamName,
			ownerName: c.ownerName,
			modelName: c.model.name,
			facilityName: c.facility.name
		},
		...billing
	};
};

export const actions: Actions = {
	issue: ({ locals, params, url }) => {
		const user = requirePermission(locals, 'manage-billing');
		const issued = issueQuote(locals.db, user, params.id, url.origin);
		if (!issued.ok) return fail(STATUS_OF_REFUSAL[issued.code], { billingError: issued.message });
		return { issued: true };
	},
	answer: async ({ locals, params, request, url }) => {
		const user = requireUser(locals);
		const found = campaignQuotes(locals.db, user, params.id);
		if (!found) error(404, { message: 'No such campaign.' });
		if (!actsForClient(user, found.campaign))
			return fail(403, { billingError: 'Only the client team accepts or declines a quote.' });
		const current = found.quotes[0];
		if (!current) return fail(409, { billingError: 'There is no quote to answer.' });
		const form = await request.formData().catch(() => null);
		const parsed = quoteDecisionSchema.safeParse({
			decision: form?.get('decision'),
			note: form?.get('note') ?? ''
		});
		if (!parsed.success)
			return fail(400, { billingError: parsed.error.issues[0]?.message ?? 'Bad answer.' });
		const decided = decideQuote(locals.db, user, current.id, parsed.data, url.origin);
		if (!decided.ok)
			return fail(STATUS_OF_REFUSAL[decided.code], { billingError: decided.message });
		return { answered: decided.quote.state };
	},
	invoice: ({ locals, params, url }) => {
		const user = requirePermission(locals, 'manage-billing');
		const issued = issueInvoice(locals.db, user, params.id, url.origin);
		if (!issued.ok) return fail(STATUS_OF_REFUSAL[issued.code], { billingError: issued.message });
		redirect(303, `/invoices/${issued.invoice.id}`);
	}
};
