import { error, redirect } from '@sveltejs/kit';
import { superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { scaleModelSchema } from '$lib/schemas/model';
import { requireRole } from '$lib/server/guards';
import { getModelFor, updateModel, writableModel } from '$lib/server/models';
import type { Actions, PageServerLoad } from './$types';
import { postedBaseVersion, refusedForm, withBaseVersion } from '$lib/server/form-versions';
import { postedForm, validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist');
	const model = getModelFor(locals.db, user, params.id);
	if (!model) error(404, { message: 'No such model.' });
	return {
		name: model.name,
		teams: user.teams,
		version: model.version,
		form: await superValidate(model, zod4(scaleModelSchema))
	};
};

export const actions: Actions = {
	default: async ({ locals, params, request }) => {
		const user = requireRole(locals, 'aerodynamicist');
		const writable = writableModel(locals.db, user, params.id);
		if (!writable.ok) error(404, { message: writable.message });
		const posted = await postedForm(request);
		const form = await validatePosted(posted, scaleModelSchema);
		if (!form.valid) return fail(400, { form });
		const saved = withBaseVersion(postedBaseVersion(posted), (base) =>
			updateModel(locals.db, user, params.id, form.data, base)
		);
		if (!saved.ok) {
			if (saved.code === 'not-found') error(404, { message: saved.message });
			return refusedForm(form, saved, saved.field === 'teamId' ? 'teamId' : 'name');
		}
		redirect(303, `/models/${params.id}`);
	}
};
