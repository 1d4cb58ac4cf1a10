import { fail } from '@sveltejs/kit';
import { message, setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { z } from 'zod';
import { invitationSchema, roleAssignmentSchema } from '$lib/schemas/user';
import type { Db } from '$lib/server/db';
import { requireRole } from '$lib/server/guards';
import { enqueueMail } from '$lib/server/mail';
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

const welcome = (sender: string) =>
	`${sender} has given you an account on Tunnelwright, where wind-tunnel campaigns are planned, reviewed and booked. To start, choose your password here:`;

/** What each one-time link mail says around the link. */
const LINK_MAILS = {
	invitation: {
		subject: 'Your invitation to Tunnelwright',
		before: welcome,
		after:
			'The link works once, and for 7 days. If you were not expecting this, ignore this message and the account stays unused.'
	},
	'new-invitation': {
		subject: 'Your invitation to Tunnelwright',
		before: welcome,
		after: 'The link works once, and for 7 days. Links sent to you before no longer work.'
	},
	'password-reset': {
		subject: 'Choose a new Tunnelwright password',
		before: (sender: string) =>
			`${sender} has sent you a link to choose a new Tunnelwright password:`,
		after:
			'The link works once, and for 7 days. Links sent to you before no longer work, and your current password stays valid until you use this one.'
	}
} satisfies Record<string, { subject: string; before: (sender: string) => string; after: string }>;

/**
 * Queued after the account change has committed, which is safe here: the link is shown to the
 * administrator as well, so a lost message never loses the invitation.
 */
function mailLink(
	db: Db,
	purpose: keyof typeof LINK_MAILS,
	to: { name: string; email: string },
	sender: string,
	link: string
): void {
	const { subject, before, after } = LINK_MAILS[purpose];
	enqueueMail(db, {
		kind: 'invitation',
		to: [to.email],
		subject,
		text: `Hello ${to.name},\n\n${before(sender)}\n\n${link}\n\n${after}\n`
	});
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
		const link = invitationLink(url.origin, invited.token);
		mailLink(locals.db, 'invitation', form.data, admin.name, link);
		return message(form, {
			text: `Invitation e-mailed to ${form.data.email}. You can also pass on this one-time link; it works for 7 days.`,
			link,
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
		const person = listUsers(locals.db).find((p) => p.id === userId);
		if (!person) return rowFailure(404, userId, 'No such account.');
		const issued = reissueInvitation(locals.db, userId, admin.id);
		if (!issued.ok) return rowFailure(STATUS_OF_REFUSAL[issued.code], userId, issued.message);
		const link = invitationLink(url.origin, issued.token);
		const purpose = person.hasPassword ? 'password-reset' : 'new-invitation';
		mailLink(locals.db, purpose, person, admin.name, link);
		return {
			row: {
				userId,
				text: `New one-time link, e-mailed to ${person.email} (earlier links no longer work):`,
				link
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
