import { message, setError, superValidate, fail } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { z } from 'zod';
import { apiTokenSchema } from '$lib/schemas/api-token';
import { createApiToken, listApiTokens, revokeApiToken } from '$lib/server/api-tokens';
import { requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';
import { postedForm, validatePosted } from '$lib/server/forms';

export type CreatedTokenMessage = { name: string; token: string };

const FORM_ID = 'api-token';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireUser(locals);
	return {
		tokens: listApiTokens(locals.db, user),
		tokenForm: await superValidate({ scopes: ['readings:write'] }, zod4(apiTokenSchema), {
			id: FORM_ID,
			errors: false
		})
	};
};

const tokenIdSchema = z.object({ tokenId: z.string().min(1) });

export const actions: Actions = {
	// The secret travels back once, in this answer; only its hash is stored.
	create: async ({ locals, request }) => {
		const user = requireUser(locals);
		const form = await validatePosted(request, apiTokenSchema, { id: FORM_ID });
		if (!form.valid) return fail(400, { tokenForm: form });
		const created = createApiToken(locals.db, user, form.data);
		if (!created.ok) {
			const field = created.field === 'expiresAt' ? 'expiresAt' : '';
			return setError(form, field, created.message, { status: STATUS_OF_REFUSAL[created.code] });
		}
		return message(form, {
			name: created.name,
			token: created.token
		} satisfies CreatedTokenMessage);
	},

	revoke: async ({ locals, request }) => {
		const user = requireUser(locals);
		const posted = await postedForm(request);
		const parsed = tokenIdSchema.safeParse(Object.fromEntries(posted ?? []));
		if (!parsed.success) return fail(400, { revokeError: 'No token given.' });
		const revoked = revokeApiToken(locals.db, user, parsed.data.tokenId);
		if (!revoked.ok) return fail(STATUS_OF_REFUSAL[revoked.code], { revokeError: revoked.message });
	}
};
