import { redirect } from '@sveltejs/kit';
import { setError, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { facilityDefaults, facilitySchema } from '$lib/schemas/facility';
import { createFacility } from '$lib/server/facilities';
import { requirePermission } from '$lib/server/guards';
import type { Actions, PageServerLoad } from './$types';
import { validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals }) => {
	requirePermission(locals, 'edit-facilities');
	return { form: await superValidate(facilityDefaults(), zod4(facilitySchema), { errors: false }) };
};

export const actions: Actions = {
	default: async ({ locals, request }) => {
		const user = requirePermission(locals, 'edit-facilities');
		const form = await validatePosted(request, facilitySchema);
		if (!form.valid) return fail(400, { form });
		const created = createFacility(locals.db, user, form.data);
		if (!created.ok) return setError(form, 'name', created.message, { status: 409 });
		redirect(303, `/facilities/${created.id}`);
	}
};
