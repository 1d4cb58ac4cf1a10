import { describe, expect, it } from 'vitest';
import { checkCredentials } from '../../src/lib/server/auth/credentials';
import { hashPassword } from '../../src/lib/server/auth/password';
import {
	acceptInvitation,
	assignRoles,
	invitationForToken,
	inviteUser,
	listUsers,
	reissueInvitation,
	sessionUser,
	setActive
} from '../../src/lib/server/users';
import { addTeam, addUser, tempDb } from './temp-db';

const PASSWORD = 'correct horse battery';

describe('invitations', () => {
	it('creates an account without a password and a one-time link that sets it', async () => {
		const db = tempDb();
		const teamId = addTeam(db, 'Client A');
		const adminId = addUser(db, 'admin@example.org', ['admin']);
		const invited = inviteUser(
			db,
			{
				email: 'new@example.org',
				name: 'New Person',
				roles: ['aerodynamicist'],
				teamIds: [teamId]
			},
			adminId
		);
		expect(invited.ok).toBe(true);
		if (!invited.ok) return;
		expect(invitationForToken(db, invited.token)).toEqual({
			email: 'new@example.org',
			name: 'New Person'
		});
		expect(
			await checkCredentials(db, { email: 'new@example.org', password: PASSWORD }, '::1')
		).toMatchObject({
			ok: false,
			reason: 'credentials'
		});

		expect(await acceptInvitation(db, invited.token, PASSWORD)).toEqual({
			ok: true,
			email: 'new@example.org'
		});
		expect(await acceptInvitation(db, invited.token, PASSWORD)).toMatchObject({
			ok: false,
			code: 'not-found'
		});
		expect(invitationForToken(db, invited.token)).toBeNull();

		const check = await checkCredentials(
			db,
			{ email: 'new@example.org', password: PASSWORD },
			'::1'
		);
		expect(check.ok).toBe(true);
		if (!check.ok) return;
		const viewer = sessionUser(db, check.user.id, check.user.sessionVersion);
		expect(viewer).toMatchObject({
			roles: ['aerodynamicist'],
			teams: [{ name: 'Client A', kind: 'client' }]
		});
	});

	it('refuses a second account for the same e-mail and unknown teams', () => {
		const db = tempDb();
		const teamId = addTeam(db, 'Client A');
		const adminId = addUser(db, 'admin@example.org', ['admin']);
		const input = {
			email: 'admin@example.org',
			name: 'X',
			roles: ['reviewer' as const],
			teamIds: [teamId]
		};
		expect(inviteUser(db, input, adminId)).toMatchObject({
			ok: false,
			code: 'conflict',
			field: 'email'
		});
		expect(
			inviteUser(db, { ...input, email: 'b@example.org', teamIds: ['nope'] }, adminId)
		).toMatchObject({
			ok: false,
			field: 'teamIds'
		});
		expect(listUsers(db)).toHaveLength(1);
	});

	it('expires links after seven days and voids older links when reissued', () => {
		const db = tempDb();
		const teamId = addTeam(db, 'Client A');
		const adminId = addUser(db, 'admin@example.org', ['admin']);
		const now = Date.UTC(2026, 0, 1);
		const first = inviteUser(
			db,
			{ email: 'n@example.org', name: 'N', roles: ['reviewer'], teamIds: [teamId] },
			adminId,
			now
		);
		if (!first.ok) throw new Error(first.message);
		expect(invitationForToken(db, first.token, now + 7 * 24 * 3600_000 + 1)).toBeNull();
		const second = reissueInvitation(db, first.userId, adminId, now);
		if (!second.ok) throw new Error(second.message);
		expect(invitationForToken(db, first.token, now)).toBeNull();
		expect(invitationForToken(db, second.token, now)).not.toBeNull();
	});
});

describe('sessions follow the account', () => {
	it('ends when the account is deactivated, and a deactivated account cannot sign in', async () => {
		const db = tempDb();
		const adminId = addUser(db, 'admin@example.org', ['admin']);
		const userId = addUser(db, 'u@example.org', ['operator'], [], await hashPassword(PASSWORD));
		expect(sessionUser(db, userId, 1)).not.toBeNull();

		expect(setActive(db, userId, false, adminId)).toEqual({ ok: true });
		expect(sessionUser(db, userId, 1)).toBeNull();
		expect(
			await checkCredentials(db, { email: 'u@example.org', password: PASSWORD }, '::1')
		).toMatchObject({
			ok: false,
			reason: 'deactivated'
		});
		// A wrong password on a deactivated account says nothing about the deactivation.
		expect(
			await checkCredentials(db, { email: 'u@example.org', password: 'wrong password!' }, '::1')
		).toMatchObject({
			reason: 'credentials'
		});

		expect(setActive(db, userId, true, adminId)).toEqual({ ok: true });
		expect(sessionUser(db, userId, 1)).toBeNull(); // the old session stays ended
		expect(sessionUser(db, userId, 3)).not.toBeNull();
	});

	it('reads roles fresh, and keeps an admin from locking themself out', () => {
		const db = tempDb();
		const adminId = addUser(db, 'admin@example.org', ['admin']);
		const userId = addUser(db, 'u@example.org', ['operator']);
		expect(assignRoles(db, userId, ['reviewer', 'operator'], adminId)).toEqual({ ok: true });
		expect(sessionUser(db, userId, 1)?.roles.sort()).toEqual(['operator', 'reviewer']);
		expect(assignRoles(db, adminId, ['reviewer'], adminId)).toMatchObject({
			ok: false,
			code: 'forbidden'
		});
		expect(setActive(db, adminId, false, adminId)).toMatchObject({ ok: false, code: 'forbidden' });
		expect(assignRoles(db, 'missing', ['reviewer'], adminId)).toMatchObject({
			ok: false,
			code: 'not-found'
		});
	});
});

describe('credentials', () => {
	it('spends comparable time on unknown accounts and wrong passwords', async () => {
		const db = tempDb();
		addUser(db, 'u@example.org', ['operator'], [], await hashPassword(PASSWORD));
		const time = async (email: string) => {
			const runs: number[] = [];
			for (let i = 0; i < 5; i++) {
				const start = performance.now();
				await checkCredentials(db, { email, password: 'not the password' }, `10.0.0.${i}`);
				runs.push(performance.now() - start);
			}
			return runs.sort((a, b) => a - b)[2]!;
		};
		await time('warm-up@example.org');
		const unknown = await time('nobody@example.org');
		const wrong = await time('u@example.org');
		// Both paths run one argon2id verification; without the decoy hash the unknown path
		// would be about a hundred times faster.
		expect(unknown / wrong).toBeGreaterThan(0.3);
		expect(unknown / wrong).toBeLessThan(3);
	});
});
