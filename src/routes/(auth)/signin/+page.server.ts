import { redirect } from '@sveltejs/kit';
import { message, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { homePath } from '$lib/roles';
import { signInSchema } from '$lib/schemas/user';
import { SIGN_IN_MESSAGES, type SignInRefusal } from '$lib/server/auth/credentials';
import { sameOriginPath } from '$lib/server/auth/redirect';
import { signInWithPassword } from '$lib/server/auth/sign-in';
import type { Actions, PageServerLoad } from './$types';
import { validatePosted } from '$lib/server/forms';

export const load: PageServerLoad = async ({ locals, url }) => {
	const form = await superValidate(
		{ redirectTo: url.searchParams.get('redirectTo') ?? undefined },
		zod4(signInSchema),
		{ errors: false }
	);
	if (locals.user)
		redirect(303, sameOriginPath(form.data.redirectTo, url.origin) ?? homePath(locals.user.roles));
	// A plain POST to Auth.js's own endpoint comes back here with `?code=` when refused.
	const code = url.searchParams.get('code');
	const refusal = Object.keys(SIGN_IN_MESSAGES).find((r) => r === code) as
		SignInRefusal | undefined;
	if (refusal) form.message = SIGN_IN_MESSAGES[refusal];
	return { form };
};

const STATUS_OF_REFUSAL = { credentials: 400, deactivated: 403, throttled: 429 } as const;

export const actions: Actions = {
	default: async (event) => {
		const form = await validatePosted(event.request, signInSchema);
		const { email, password, redirectTo } = form.data;
		// The password never travels back to the browser.
		form.data.password = '';
		if (!form.valid) return fail(400, { form });

		const result = await signInWithPassword(event, { email, password });
		if (!result.ok) {
			const text =
				result.reason === 'throttled'
					? `Too many failed sign-ins. Try again in ${result.retryAfter_s} s.`
					: SIGN_IN_MESSAGES[result.reason];
			return message(form, text, { status: STATUS_OF_REFUSAL[result.reason] });
		}
		redirect(303, sameOriginPath(redirectTo, event.url.origin) ?? '/');
	}
};
