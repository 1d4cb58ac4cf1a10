import { json } from '@sveltejs/kit';
import { refusalResponse } from '$lib/server/api';
import { requirePermission } from '$lib/server/guards';
import { submitCampaign } from '$lib/server/review';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = ({ locals, params, url }) => {
	const user = requirePermission(locals, 'draft-campaigns');
	const submitted = submitCampaign(locals.db, user, params.id, url.origin);
	return submitted.ok
		? json({ revision: submitted.revision }, { status: 201 })
		: refusalResponse(submitted);
};
