import { fail } from '@sveltejs/kit';
import { message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { z } from 'zod';
import { invitationSchema, roleAssignmentSchema } from '$lib/schemas/user';
import { requireRole } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import {
	assignRoles,
	inviteUser,
	listTeams,
	listUsers,
	reissueInvitation,
	setActive
} from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export type InvitationMessage = { text: string; link?: string; email?: string };

export const load: PageServerLoad = async ({ locals }) => {
	requireRole(locals, 'admin');
	return {
		people: listUsers(locals.db),
		teams: listTeams(locals.db),
		inviteForm: await superValidate(zod4(invitationSchema), { id: 'invite' })
	};
};

function invitationLink(origin: string, token: string): string {
	return `${origin}/invitation/${token}`;
}

const userIdSchema = z.object({ userId: z.string().min(1) });

/** The row actions answer with the affected user's id so the page shows the note beside it. */
function rowFailure(status: number, userId: string, text: string) {
	return fail(status, { row: { userId, text } });
}

export const actions: Actions = {
	invite: async ({ locals, request, url }) => {
		const admin = requireRole(locals, 'admin');
		const form = await superValidate(request, zod4(invitationSchema), { id: 'invite' });
		if (!form.valid) return fail(400, { inviteForm: form });
		const invited = inviteUser(locals.db, form.data, admin.id);
		if (!invited.ok) {
			const field = invited.field === 'teamIds' ? 'teamIds._errors' : 'email';
			return setError(form, field, invited.message, { status: STATUS_OF_REFUSAL[invited.code] });
		}
		return message(form, {
			text: `Invitation ready for ${form.data.email}. Send them this one-time link; it works for 7 days.`,
			link: invitationLink(url.origin, invited.token),
			email: form.data.email
		} satisfies InvitationMessage);
	},

	roles: async ({ locals, request }) => {
		const admin = requireRole(locals, 'admin');
		const data = await request.formData();
		const parsed = roleAssignmentSchema.safeParse({
			userId: data.get('userId'),
			roles: data.getAll('roles')
		});
		const userId = String(data.get('userId') ?? '');
		if (!parsed.success) {
			return rowFailure(400, userId, parsed.error.issues[0]?.message ?? 'Invalid roles.');
		}
		const done = assignRoles(locals.db, parsed.data.userId, parsed.data.roles, admin.id);
		if (!done.ok) return rowFailure(STATUS_OF_REFUSAL[done.code], userId, done.message);
		return { row: { userId, text: 'Roles saved.' } };
	},

	deactivate: async ({ locals, request }) => setActiveFromForm(locals, request, false),
	reactivate: async ({ locals, request }) => setActiveFromForm(locals, request, true),

	reissue: async ({ locals, request, url }) => {
		const admin = requireRole(locals, 'admin');
		const parsed = userIdSchema.safeParse(Object.fromEntries(await request.formData()));
		if (!parsed.success) return rowFailure(400, '', 'No account given.');
		const { userId } = parsed.data;
		const issued = reissueInvitation(locals.db, userId, admin.id);
		if (!issued.ok) return rowFailure(STATUS_OF_REFUSAL[issued.code], userId, issued.message);
		return {
			row: {
				userId,
				text: 'New one-time link (earlier links no longer work):',
				link: invitationLink(url.origin, issued.token)
			}
		};
	}
};

async function setActiveFromForm(locals: App.Locals, request: Request, active: boolean) {
	const admin = requireRole(locals, 'admin');
	const parsed = userIdSchema.safeParse(Object.fromEntries(await request.formData()));
	if (!parsed.success) return rowFailure(400, '', 'No account given.');
	const { userId } = parsed.data;
	const done = setActive(locals.db, userId, active, admin.id);
	if (!done.ok) return rowFailure(STATUS_OF_REFUSAL[done.code], userId, done.message);
	return {
		row: {
			userId,
			text: active ? 'Account reactivated.' : 'Account deactivated; its sessions ended.'
		}
	};
}
