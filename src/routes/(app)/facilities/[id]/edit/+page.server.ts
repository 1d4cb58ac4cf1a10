import { error, redirect } from '@sveltejs/kit';
import { setError, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { facilitySchema } from '$lib/schemas/facility';
import { getFacility, updateFacility } from '$lib/server/facilities';
import { requireRole } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';
import { validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals, params }) => {
	requireRole(locals, 'operator', 'admin');
	const found = getFacility(locals.db, params.id);
	if (!found) error(404, { message: 'No such facility.' });
	const { id: _, createdAt: __, ...values } = found;
	return {
		name: found.name,
		id: found.id,
		form: await superValidate(values, zod4(facilitySchema))
	};
};

export const actions: Actions = {
	default: async ({ locals, params, request }) => {
		requireRole(locals, 'operator', 'admin');
		if (!getFacility(locals.db, params.id)) error(404, { message: 'No such facility.' });
		const form = await validatePosted(request, facilitySchema);
		if (!form.valid) return fail(400, { form });
		const saved = updateFacility(locals.db, params.id, form.data);
		if (!saved.ok)
			return setError(form, 'name', saved.message, { status: STATUS_OF_REFUSAL[saved.code] });
		redirect(303, `/facilities/${params.id}`);
	}
};
