import {
	message,
	setError,
	superValidate,
	type FormPathLeavesWithErrors,
	type SuperValidated,
	fail
} from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import {
	accountActionSchema,
	invitationSchema,
	roleAssignmentSchema,
	type AdminNote
} from '$lib/schemas/user';
import { requireRole } from '$lib/server/guards';
import { accountLink, mailAccountLink } from '$lib/server/mail';
import { refuse, STATUS_OF_REFUSAL, type Refusal } from '$lib/server/outcome';
import {
	assignRoles,
	INVITATION_LIFETIME_DAYS,
	inviteUser,
	listTeams,
	listUsers,
	endSessions,
	reissueInvitation,
	setActive
} from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	requireRole(locals, 'admin');
	return {
		people: listUsers(locals.db),
		teams: listTeams(locals.db),
		inviteForm: await superValidate(zod4(invitationSchema), { id: 'invite' })
	};
};

/**
 * A refusal shown at the field it names (a list's own errors sit under `_errors`), or for the
 * whole form when it names none.
 */
function refused<T extends Record<string, unknown>>(
	form: SuperValidated<T, AdminNote>,
	r: Refusal
) {
	const value = r.field === undefined ? undefined : form.data[r.field];
	const path = r.field === undefined ? '' : Array.isArray(value) ? `${r.field}._errors` : r.field;
	return setError(form, path as FormPathLeavesWithErrors<T> | '', r.message, {
		status: STATUS_OF_REFUSAL[r.code]
	});
}

const accountForm = (request: Request) =>
	superValidate<typeof accountActionSchema._zod.output, AdminNote>(
		request,
		zod4(accountActionSchema)
	);

async function changeActive(locals: App.Locals, request: Request, active: boolean) {
	const admin = requireRole(locals, 'admin');
	const form = await accountForm(request);
	if (!form.valid) return fail(400, { form });
	const done = setActive(locals.db, form.data.userId, active, admin.id);
	if (!done.ok) return refused(form, done);
	return message(form, {
		text: active ? 'Account reactivated.' : 'Account deactivated; its sessions ended.'
	});
}

export const actions: Actions = {
	invite: async ({ locals, request, url }) => {
		const admin = requireRole(locals, 'admin');
		const form = await superValidate<typeof invitationSchema._zod.output, AdminNote>(
			request,
			zod4(invitationSchema),
			{ id: 'invite' }
		);
		if (!form.valid) return fail(400, { inviteForm: form });
		const invited = inviteUser(locals.db, form.data, admin.id);
		if (!invited.ok) return refused(form, invited);
		const link = accountLink(url.origin, invited.token);
		mailAccountLink(locals.db, 'invitation', form.data, admin.name, link);
		return message(form, {
			text: `Invitation e-mailed to ${form.data.email}. You can also pass on this one-time link; it works for ${INVITATION_LIFETIME_DAYS} days.`,
			link,
			email: form.data.email
		});
	},

	roles: async ({ locals, request }) => {
		const admin = requireRole(locals, 'admin');
		const form = await superValidate<typeof roleAssignmentSchema._zod.output, AdminNote>(
			request,
			zod4(roleAssignmentSchema)
		);
		if (!form.valid) return fail(400, { form });
		const done = assignRoles(locals.db, form.data.userId, form.data.roles, admin.id);
		if (!done.ok) return refused(form, done);
		return message(form, { text: 'Roles saved.' });
	},

	deactivate: ({ locals, request }) => changeActive(locals, request, false),
	reactivate: ({ locals, request }) => changeActive(locals, request, true),

	endSessions: async ({ locals, request }) => {
		requireRole(locals, 'admin');
		const form = await accountForm(request);
		if (!form.valid) return fail(400, { form });
		const done = endSessions(locals.db, form.data.userId);
		if (!done.ok) return refused(form, done);
		return message(form, { text: 'Signed out everywhere; the next request asks for sign-in.' });
	},

	reissue: async ({ locals, request, url }) => {
		const admin = requireRole(locals, 'admin');
		const form = await accountForm(request);
		if (!form.valid) return fail(400, { form });
		const person = listUsers(locals.db).find((p) => p.id === form.data.userId);
		if (!person) return refused(form, refuse('not-found', 'No such account.'));
		const issued = reissueInvitation(locals.db, person.id, admin.id);
		if (!issued.ok) return refused(form, issued);
		const link = accountLink(url.origin, issued.token);
		mailAccountLink(
			locals.db,
			person.hasPassword ? 'password-reset' : 'new-invitation',
			person,
			admin.name,
			link
		);
		return message(form, {
			text: `New one-time link, e-mailed to ${person.email} (earlier links no longer work):`,
			link
		});
	}
};
