import { isActionFailure, isHttpError } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import { listOutbox } from '../../src/lib/server/mail';
import { listUsers, sessionUser } from '../../src/lib/server/users';
import { actions } from '../../src/routes/(app)/admin/+page.server';
import { requestEvent } from './request-event';
import { addTeam, addUser, tempDb } from './temp-db';

type ActionName = keyof typeof actions;

/** Posts a form to an admin action; failures and successes both come back as `{ status, form }`. */
async function post(
	db: Db,
	actor: SessionUser,
	action: ActionName,
	form: Record<string, string | string[]>
) {
	const event = requestEvent({ db, user: actor, form, path: `/admin?/${action}` });
	const answer = await actions[action]!(event as never);
	const { status, data } = isActionFailure(answer)
		? answer
		: { status: 200, data: answer as Record<string, unknown> };
	return { status, form: (data as { form: FormAnswer }).form };
}

type FormAnswer = {
	id: string;
	valid: boolean;
	data: Record<string, unknown>;
	errors: Record<string, unknown>;
	message?: { text: string; link?: string };
};

function world() {
	const db = tempDb();
	const teamId = addTeam(db, 'Facility', 'staff');
	const adminId = addUser(db, 'admin@example.org', ['admin'], [teamId]);
	const otherId = addUser(db, 'other@example.org', ['reviewer'], [teamId], 'stored-hash');
	const admin = sessionUser(db, adminId, 1)!;
	return { db, admin, adminId, otherId };
}

describe('the people page actions', () => {
	it('saves roles and says so', async () => {
		const { db, admin, otherId } = world();
		const answer = await post(db, admin, 'roles', {
			__superform_id: `roles-${otherId}`,
			userId: otherId,
			roles: ['reviewer', 'operator']
		});
		expect(answer.status).toBe(200);
		expect(answer.form.id).toBe(`roles-${otherId}`);
		expect(answer.form.message?.text).toBe('Roles saved.');
		expect(
			listUsers(db)
				.find((p) => p.id === otherId)
				?.roles.sort()
		).toEqual(['operator', 'reviewer']);
	});

	it('refuses a role change at the roles field and keeps what was ticked', async () => {
		const { db, admin, adminId } = world();
		const answer = await post(db, admin, 'roles', {
			__superform_id: `roles-${adminId}`,
			userId: adminId,
			roles: ['operator']
		});
		expect(answer.status).toBe(403);
		expect(answer.form.id).toBe(`roles-${adminId}`);
		expect(answer.form.data.roles).toEqual(['operator']);
		expect(answer.form.errors).toEqual({
			roles: { _errors: ['You cannot take the administrator role from yourself.'] }
		});
		expect(listUsers(db).find((p) => p.id === adminId)?.roles).toEqual(['admin']);
	});

	it('answers a form without roles or without an account with 400 at the field', async () => {
		const { db, admin, otherId } = world();
		const noRoles = await post(db, admin, 'roles', { userId: otherId });
		expect(noRoles.status).toBe(400);
		expect(noRoles.form.errors).toEqual({
			roles: { _errors: ['Give the account at least one role.'] }
		});
		const noAccount = await post(db, admin, 'deactivate', {});
		expect(noAccount.status).toBe(400);
		expect(noAccount.form.errors).toEqual({ userId: ['No account given.'] });
	});

	it('deactivates others but not oneself, whose refusal is for the whole form', async () => {
		const { db, admin, adminId, otherId } = world();
		const self = await post(db, admin, 'deactivate', { userId: adminId });
		expect(self.status).toBe(403);
		expect(self.form.errors).toEqual({ _errors: ['You cannot deactivate your own account.'] });
		const other = await post(db, admin, 'deactivate', { userId: otherId });
		expect(other.form.message?.text).toBe('Account deactivated; its sessions ended.');
		expect(listUsers(db).find((p) => p.id === otherId)?.active).toBe(false);
		const back = await post(db, admin, 'reactivate', { userId: otherId });
		expect(back.form.message?.text).toBe('Account reactivated.');
		expect(listUsers(db).find((p) => p.id === otherId)?.active).toBe(true);
	});

	it('mails a password-reset link to an account with a password, and refuses an unknown one', async () => {
		const { db, admin, otherId } = world();
		const answer = await post(db, admin, 'reissue', { userId: otherId });
		expect(answer.form.message?.link).toMatch(/^http:\/\/localhost\/invitation\/[\w-]{43}$/);
		const [mail] = listOutbox(db, { limit: 5 });
		expect(mail).toMatchObject({
			to: ['other@example.org'],
			subject: 'Choose a new Tunnelwright password'
		});
		expect(mail!.text).toContain(answer.form.message!.link!);
		const unknown = await post(db, admin, 'reissue', { userId: 'nobody' });
		expect(unknown.status).toBe(404);
		expect(unknown.form.errors).toEqual({ _errors: ['No such account.'] });
	});

	it('is refused to everyone but administrators', async () => {
		const { db, otherId } = world();
		const reviewer = sessionUser(db, otherId, 1)!;
		const refused = await post(db, reviewer, 'deactivate', { userId: otherId }).catch(
			(thrown: unknown) => thrown
		);
		expect(isHttpError(refused) && refused.status).toBe(403);
	});
});
