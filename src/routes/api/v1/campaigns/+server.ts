import { json } from '@sveltejs/kit';
import { campaignSchema } from '$lib/schemas/campaign';
import { readJson, refusalResponse } from '$lib/server/api';
import { createCampaign, listCampaignsFor } from '$lib/server/campaigns';
import { requireRole, requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals }) => {
	const user = requireUser(locals);
	return json({ campaigns: listCampaignsFor(locals.db, user) });
};

export const POST: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'aerodynamicist');
	const body = await readJson(event, campaignSchema);
	if (!body.ok) return body.response;
	const created = createCampaign(event.locals.db, user, body.data);
	return created.ok ? json({ id: created.id }, { status: 201 }) : refusalResponse(created);
};
