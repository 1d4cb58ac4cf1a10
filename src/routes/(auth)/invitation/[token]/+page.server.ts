import { redirect } from '@sveltejs/kit';
import { message, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { setPasswordSchema } from '$lib/schemas/user';
import { signInWithPassword } from '$lib/server/auth/sign-in';
import { acceptInvitation, invitationForToken } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';
import { validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals, params }) => ({
	invitee: invitationForToken(locals.db, params.token),
	form: await superValidate(zod4(setPasswordSchema))
});

export const actions: Actions = {
	default: async (event) => {
		const form = await validatePosted(event.request, setPasswordSchema);
		const { password } = form.data;
		form.data.password = form.data.confirm = '';
		if (!form.valid) return fail(400, { form });

		const accepted = await acceptInvitation(event.locals.db, event.params.token, password);
		if (!accepted.ok) return message(form, accepted.message, { status: 410 });
		const signedIn = await signInWithPassword(event, { email: accepted.email, password });
		redirect(303, signedIn.ok ? '/' : '/signin');
	}
};
