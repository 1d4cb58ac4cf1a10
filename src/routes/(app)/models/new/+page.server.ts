import { redirect } from '@sveltejs/kit';
import { setError, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { scaleModelSchema } from '$lib/schemas/model';
import { requireRole } from '$lib/server/guards';
import { createModel } from '$lib/server/models';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';
import { validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireRole(locals, 'aerodynamicist');
	const start = {
		teamId: user.teams.find((t) => t.kind === 'client')?.id ?? user.teams[0]?.id ?? '',
		kind: 'road-vehicle' as const,
		scaleDenominator: 4,
		dragCoefficient: null,
		modelVolume_m3: null
	};
	return {
		teams: user.teams,
		form: await superValidate(start, zod4(scaleModelSchema), { errors: false })
	};
};

export const actions: Actions = {
	default: async ({ locals, request }) => {
		const user = requireRole(locals, 'aerodynamicist');
		const form = await validatePosted(request, scaleModelSchema);
		if (!form.valid) return fail(400, { form });
		const created = createModel(locals.db, user, form.data);
		if (!created.ok) {
			return setError(form, created.field === 'teamId' ? 'teamId' : 'name', created.message, {
				status: STATUS_OF_REFUSAL[created.code]
			});
		}
		redirect(303, `/models/${created.id}`);
	}
};
