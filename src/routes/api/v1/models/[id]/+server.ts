import { error } from '@sveltejs/kit';
import { scaleModelSchema } from '$lib/schemas/model';
import { readJson, refusalResponse } from '$lib/server/api';
import { requireRole } from '$lib/server/guards';
import { expectedVersion, versionedJson } from '$lib/server/preconditions';
import { getModelFor, listAttachments, updateModel, writableModel } from '$lib/server/models';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist', 'admin');
	const model = getModelFor(locals.db, user, params.id);
	if (!model) error(404, { message: 'No such model.' });
	return versionedJson({ model, attachments: listAttachments(locals.db, model.id) }, model.version);
};

export const PUT: RequestHandler = async (event) => {
	const user = requireRole(event.locals, 'aerodynamicist');
	const writable = writableModel(event.locals.db, user, event.params.id);
	if (!writable.ok) return refusalResponse(writable);
	const expected = expectedVersion(event.request);
	if (!expected.ok) return expected.response;
	const body = await readJson(event, scaleModelSchema);
	if (!body.ok) return body.response;
	const saved = updateModel(event.locals.db, user, event.params.id, body.data, expected.base);
	return saved.ok
		? versionedJson({ id: event.params.id, version: saved.version }, saved.version)
		: refusalResponse(saved);
};
