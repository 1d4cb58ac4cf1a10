import { error, fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/guards';
import { canWriteModel } from '$lib/server/access';
import { addAttachment, getModelFor, listAttachments, writableModel } from '$lib/server/models';
import type { Actions, PageServerLoad } from './$types';
import { postedForm } from '$lib/server/forms';

export const load: PageServerLoad = ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist', 'admin');
	const model = getModelFor(locals.db, user, params.id);
	if (!model) error(404, { message: 'No such model.' });
	return {
		model,
		attachments: listAttachments(locals.db, model.id),
		canEdit: canWriteModel(user, model)
	};
};

export const actions: Actions = {
	attach: async ({ locals, params, request }) => {
		const user = requireRole(locals, 'aerodynamicist');
		const writable = writableModel(locals.db, user, params.id);
		if (!writable.ok) error(404, { message: writable.message });
		const file = (await postedForm(request))?.get('file');
		if (!(file instanceof File) || file.size === 0)
			return fail(400, { attachError: 'Choose a file to attach.' });
		const added = await addAttachment(locals.db, locals.files, user, params.id, {
			name: file.name,
			bytes: new Uint8Array(await file.arrayBuffer())
		});
		if (!added.ok) {
			if (added.code === 'not-found') error(404, { message: added.message });
			return fail(400, { attachError: added.message });
		}
		return { attached: file.name };
	}
};
