import { error, fail, redirect } from '@sveltejs/kit';
import {
	campaignActor,
	canEditCampaign,
	canReadBilling,
	canUploadReadings
} from '$lib/server/access';
import { campaignSlots } from '$lib/server/bookings';
import { figuresOrProblem } from '$lib/server/campaign-export';
import { deleteCampaign, getCampaignFor } from '$lib/server/campaigns';
import { requireRole, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL, type Refusal } from '$lib/server/outcome';
import {
	auditTrail,
	listRevisions,
	moveCampaign,
	returnNotes,
	submitCampaign
} from '$lib/server/review';
import { READINGS_MAX_BYTES } from '$lib/schemas/readings';
import { readingsOverview, receiveReadings } from '$lib/server/readings';
import { availableActions } from '$lib/workflow';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	const { figures, problem } = figuresOrProblem(found);
	return {
		campaign: found,
		figures,
		problem,
		canEdit: canEditCampaign(user, found),
		seesBilling: canReadBilling(user, found),
		actions: availableActions(found.state, campaignActor(user, found)),
		revisions: listRevisions(locals.db, user, found.id) ?? [],
		trail: auditTrail(locals.db, user, found.id) ?? [],
		returned: returnNotes(locals.db, user, found.id),
		slots: campaignSlots(locals.db, found.id),
		readings: readingsOverview(locals.db, user, found.id)
	};
};

function refusalError(refusal: Refusal): never {
	error(STATUS_OF_REFUSAL[refusal.code], { message: refusal.message });
}

export const actions: Actions = {
	submit: ({ locals, params, url }) => {
		const user = requireRole(locals, 'aerodynamicist');
		const submitted = submitCampaign(locals.db, user, params.id, url.origin);
		if (!submitted.ok)
			return fail(STATUS_OF_REFUSAL[submitted.code], { workflowError: submitted.message });
		return { submitted: submitted.revision };
	},
	withdraw: ({ locals, params }) => move(locals, params.id, 'withdraw'),
	revise: ({ locals, params }) => move(locals, params.id, 'revise'),
	/** The upload form without JavaScript; with it, the page posts to the API and shows progress. */
	readings: async ({ locals, params, request }) => {
		const user = requireUser(locals);
		const found = getCampaignFor(locals.db, user, params.id);
		if (!found) error(404, { message: 'No such campaign.' });
		if (!canUploadReadings(user, found))
			return fail(403, {
				readingsAnswer: { message: 'You cannot send readings for this campaign.' }
			});
		const form = await request.formData().catch(() => null);
		const file = form?.get('file');
		if (!(file instanceof File) || file.size === 0)
			return fail(400, { readingsAnswer: { message: 'Choose a readings file to upload.' } });
		if (file.size > READINGS_MAX_BYTES)
			return fail(413, {
				readingsAnswer: {
					message: `The file is over ${READINGS_MAX_BYTES / 1024 / 1024} MiB; split it by runs.`
				}
			});
		const received = await receiveReadings(
			locals.db,
			locals.files,
			user,
			params.id,
			{
				fileName: file.name.slice(0, 200) || 'readings.csv',
				mediaType: file.name.toLowerCase().endsWith('.json') ? 'application/json' : 'text/csv',
				bytes: new Uint8Array(await file.arrayBuffer()),
				channel: 'page'
			},
			{ replace: form?.get('replace') === 'on' }
		);
		if (!received.ok) {
			const { message, problems, problemCount } = received;
			return fail(STATUS_OF_REFUSAL[received.code], {
				readingsAnswer: { message, problems, problemCount }
			});
		}
		return { readingsStored: received.readingCount };
	},
	delete: ({ locals, params }) => {
		const user = requireRole(locals, 'aerodynamicist');
		const removed = deleteCampaign(locals.db, user, params.id);
		if (!removed.ok) refusalError(removed);
		redirect(303, '/campaigns');
	}
};

function move(locals: App.Locals, id: string, action: 'withdraw' | 'revise') {
	const user = requireRole(locals, 'aerodynamicist');
	const moved = moveCampaign(locals.db, user, id, action);
	if (!moved.ok) return fail(STATUS_OF_REFUSAL[moved.code], { workflowError: moved.message });
	return { moved: action };
}
