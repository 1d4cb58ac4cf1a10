import { fail, redirect } from '@sveltejs/kit';
import { signOut } from '$lib/server/auth';
import { postedForm } from '$lib/server/forms';
import { endSessions } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	// Auth.js reads the form itself and fails on a body that is not one. Signing out ends the
	// session on the server too: the token would otherwise stay valid until it expires.
	default: async (event) => {
		if (!(await postedForm(event.request.clone()))) return fail(400);
		if (event.locals.user) endSessions(event.locals.db, event.locals.user.id);
		return signOut(event);
	}
};
