import { error } from '@sveltejs/kit';
import { campaignSchema } from '$lib/schemas/campaign';
import { readJson, refusalResponse } from '$lib/server/api';
import {
	campaignResource,
	deleteCampaign,
	editableCampaign,
	getCampaignFor,
	updateCampaign
} from '$lib/server/campaigns';
import { requireRole, requireUser } from '$lib/server/guards';
import { expectedVersion, versionedJson } from '$lib/server/preconditions';
import type { RequestHandler } from './$types';

/**
 * Answers the body PUT accepts, so a client can read, change a field and write it back; the
 * read-only fields beside it are not in the campaign schema, which PUT's parse strips.
 */
export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	return versionedJson(campaignResource(found), found.version);
};

export const PUT: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'aerodynamicist');
	const editable = editableCampaign(event.locals.db, user, event.params.id);
	if (!editable.ok) return refusalResponse(editable);
	const expected = expectedVersion(event.request);
	if (!expected.ok) return expected.response;
	const body = await readJson(event, campaignSchema);
	if (!body.ok) return body.response;
	const saved = updateCampaign(event.locals.db, user, event.params.id, body.data, expected.base);
	return saved.ok
		? versionedJson({ id: event.params.id, version: saved.version }, saved.version)
		: refusalResponse(saved);
};

export const DELETE: RequestHandler = ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist');
	const removed = deleteCampaign(locals.db, user, params.id);
	return removed.ok ? new Response(null, { status: 204 }) : refusalResponse(removed);
};
