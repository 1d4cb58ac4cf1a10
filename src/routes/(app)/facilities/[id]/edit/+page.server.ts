import { error, redirect } from '@sveltejs/kit';
import { superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { facilitySchema } from '$lib/schemas/facility';
import { getFacility, updateFacility } from '$lib/server/facilities';
import { requireRole } from '$lib/server/guards';
import type { Actions, PageServerLoad } from './$types';
import { postedBaseVersion, refusedForm, withBaseVersion } from '$lib/server/form-versions';
import { postedForm, validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals, params }) => {
	requireRole(locals, 'operator', 'admin');
	const found = getFacility(locals.db, params.id);
	if (!found) error(404, { message: 'No such facility.' });
	const { id: _, createdAt: __, ...values } = found;
	return {
		name: found.name,
		id: found.id,
		version: found.version,
		form: await superValidate(values, zod4(facilitySchema))
	};
};

export const actions: Actions = {
	default: async ({ locals, params, request }) => {
		const user = requireRole(locals, 'operator', 'admin');
		if (!getFacility(locals.db, params.id)) error(404, { message: 'No such facility.' });
		const posted = await postedForm(request);
		const form = await validatePosted(posted, facilitySchema);
		if (!form.valid) return fail(400, { form });
		const saved = withBaseVersion(postedBaseVersion(posted), (base) =>
			updateFacility(locals.db, user, params.id, form.data, base)
		);
		if (!saved.ok) return refusedForm(form, saved, saved.field ?? '');
		redirect(303, `/facilities/${params.id}`);
	}
};
