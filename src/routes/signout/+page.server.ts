import { fail, redirect } from '@sveltejs/kit';
import { signOut } from '$lib/server/auth';
import { postedForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	// Auth.js reads the form itself and fails on a body that is not one.
	default: async (event) => ((await postedForm(event.request.clone())) ? signOut(event) : fail(400))
};
