import { json } from '@sveltejs/kit';
import { decisionSchema } from '$lib/schemas/review';
import { readJson, refusalResponse } from '$lib/server/api';
import { requirePermission } from '$lib/server/guards';
import { decideRevision, decisionAccess } from '$lib/server/review';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async (event) => {
	const user = requirePermission(event.locals, 'decide-campaigns');
	const allowed = decisionAccess(event.locals.db, user, event.params.id);
	if (!allowed.ok) return refusalResponse(allowed);
	const body = await readJson(event, decisionSchema);
	if (!body.ok) return body.response;
	const decided = decideRevision(
		event.locals.db,
		user,
		event.params.id,
		body.data,
		event.url.origin
	);
	return decided.ok ? json({ ok: true }, { status: 201 }) : refusalResponse(decided);
};
