import { error } from '@sveltejs/kit';
import { message, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { diffRevisions } from '$lib/review/diff';
import { decisionSchema } from '$lib/schemas/review';
import { campaignActor } from '$lib/server/access';
import { getCampaignFor } from '$lib/server/campaigns';
import { requirePermission, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import { decideRevision, decisionAccess, getRevision } from '$lib/server/review';
import { availableActions } from '$lib/workflow';
import type { Actions, PageServerLoad } from './$types';
import { validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals, params }) => {
	const user = requireUser(locals);
	const number = Number(params.n);
	const found = getCampaignFor(locals.db, user, params.id);
	const revision =
		found && Number.isInteger(number) ? getRevision(locals.db, user, found.id, number) : undefined;
	if (!found || !revision) error(404, { message: 'No such revision.' });
	const previous = number > 1 ? getRevision(locals.db, user, found.id, number - 1) : undefined;
	const canDecide =
		number === found.lastRevision &&
		!revision.decision &&
		availableActions(found.state, campaignActor(user, found)).includes('approve');
	return {
		campaign: {
			id: found.id,
			name: found.name,
			state: found.state,
			lastRevision: found.lastRevision,
			ownerName: found.ownerName
		},
		revision,
		previousNumber: previous?.number ?? null,
		diff: previous ? diffRevisions(previous.snapshot, revision.snapshot) : null,
		canDecide,
		isOwnCampaign: campaignActor(user, found).isOwner,
		form: await superValidate(
			{ revision: number, verdict: 'approve', summary: '', notes: [] },
			zod4(decisionSchema),
			{ errors: false }
		)
	};
};

export const actions: Actions = {
	decide: async ({ locals, params, request, url }) => {
		const user = requirePermission(locals, 'decide-campaigns');
		const allowed = decisionAccess(locals.db, user, params.id);
		if (!allowed.ok) error(STATUS_OF_REFUSAL[allowed.code], { message: allowed.message });
		const form = await validatePosted(request, decisionSchema);
		if (!form.valid) return fail(400, { form });
		const decided = decideRevision(locals.db, user, params.id, form.data, url.origin);
		if (!decided.ok)
			return message(form, decided.message, { status: STATUS_OF_REFUSAL[decided.code] });
		return message(form, 'Decision recorded.');
	}
};
