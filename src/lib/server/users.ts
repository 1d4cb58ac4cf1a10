import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { createHash, randomBytes } from 'node:crypto';
import type { Role, SessionUser, TeamRef } from '../roles';

export type { SessionUser, TeamRef };
import type { Invitation } from '../schemas/user';
import { hashPassword } from './auth/password';
import { writeTransaction, type Db, type DbOrTx } from './db/open';
import { preparedPerDatabase } from './db/prepared';
import { invitation, team, teamMember, user, userRole } from './db/schema';
import { refuse, type Outcome } from './outcome';

export type UserListing = SessionUser & { active: boolean; hasPassword: boolean; createdAt: Date };

export const INVITATION_LIFETIME_DAYS = 7;
const INVITATION_LIFETIME_MS = INVITATION_LIFETIME_DAYS * 24 * 3600_000;

function rolesAndTeams(db: Db, userIds: string[]) {
	const roles = db.select().from(userRole).where(inArray(userRole.userId, userIds)).all();
	const teams = db
		.select({ userId: teamMember.userId, id: team.id, name: team.name, kind: team.kind })
		.from(teamMember)
		.innerJoin(team, eq(team.id, teamMember.teamId))
		.where(inArray(teamMember.userId, userIds))
		.orderBy(asc(team.name))
		.all();
	return {
		rolesOf: (id: string) => roles.filter((r) => r.userId === id).map((r) => r.role),
		teamsOf: (id: string): TeamRef[] =>
			teams.filter((t) => t.userId === id).map(({ id, name, kind }) => ({ id, name, kind }))
	};
}

// Every request with a session runs these.
const sessionQueries = preparedPerDatabase((db) => {
	const userId = sql.placeholder('userId');
	return {
		account: db
			.select({
				id: user.id,
				email: user.email,
				name: user.name,
				active: user.active,
				sessionVersion: user.sessionVersion
			})
			.from(user)
			.where(eq(user.id, userId))
			.prepare(),
		roles: db
			.select({ role: userRole.role })
			.from(userRole)
			.where(eq(userRole.userId, userId))
			.prepare(),
		teams: db
			.select({ id: team.id, name: team.name, kind: team.kind })
			.from(teamMember)
			.innerJoin(team, eq(team.id, teamMember.teamId))
			.where(eq(teamMember.userId, userId))
			.orderBy(asc(team.name))
			.prepare()
	};
});

/**
 * The signed-in user as of this request, or null when the account is gone, deactivated, or its
 * sessions were ended after this token was issued. Read on every request, so a change of roles
 * or a deactivation takes effect at once.
 */
export function sessionUser(db: Db, userId: string, sessionVersion: number): SessionUser | null {
	const queries = sessionQueries(db);
	const row = queries.account.get({ userId });
	if (!row || !row.active || row.sessionVersion !== sessionVersion) return null;
	return {
		id: row.id,
		email: row.email,
		name: row.name ?? row.email,
		roles: queries.roles.all({ userId }).map((r) => r.role),
		teams: queries.teams.all({ userId })
	};
}

export function findUserByEmail(db: Db, email: string) {
	return db.select().from(user).where(eq(user.email, email.trim().toLowerCase())).get();
}

export function listUsers(db: Db): UserListing[] {
	const rows = db.select().from(user).orderBy(asc(user.email)).all();
	const { rolesOf, teamsOf } = rolesAndTeams(
		db,
		rows.map((r) => r.id)
	);
	return rows.map((r) => ({
		id: r.id,
		email: r.email,
		name: r.name ?? r.email,
		roles: rolesOf(r.id),
		teams: teamsOf(r.id),
		active: r.active,
		hasPassword: r.passwordHash != null,
		createdAt: r.createdAt
	}));
}

export function listTeams(db: Db): TeamRef[] {
	return db
		.select({ id: team.id, name: team.name, kind: team.kind })
		.from(team)
		.orderBy(asc(team.kind), asc(team.name))
		.all();
}

function distinct<T>(values: T[]): T[] {
	return [...new Set(values)];
}

function hashToken(token: string): string {
	return createHash('sha256').update(token).digest('hex');
}

/** Issues a fresh one-time token for the user, voiding earlier unused ones. */
function issueInvitation(
	db: DbOrTx,
	userId: string,
	createdBy: string | null,
	now: number
): string {
	const token = randomBytes(32).toString('base64url');
	db.update(invitation)
		.set({ usedAt: new Date(now) })
		.where(and(eq(invitation.userId, userId), isNull(invitation.usedAt)))
		.run();
	db.insert(invitation)
		.values({
			userId,
			tokenHash: hashToken(token),
			createdBy,
			expiresAt: new Date(now + INVITATION_LIFETIME_MS)
		})
		.run();
	return token;
}

export function inviteUser(
	db: Db,
	input: Invitation,
	invitedBy: string,
	now = Date.now()
): Outcome<{ userId: string; token: string }> {
	if (findUserByEmail(db, input.email)) {
		return refuse('conflict', 'An account with this e-mail already exists.', 'email');
	}
	const knownTeams = db
		.select({ id: team.id })
		.from(team)
		.where(inArray(team.id, input.teamIds))
		.all();
	if (knownTeams.length !== new Set(input.teamIds).size) {
		return refuse('invalid', 'One of the chosen teams does not exist.', 'teamIds');
	}
	return writeTransaction(db, (tx) => {
		const created = tx
			.insert(user)
			.values({ email: input.email, name: input.name })
			.returning({ id: user.id })
			.get();
		tx.insert(userRole)
			.values(distinct(input.roles).map((role) => ({ userId: created.id, role })))
			.run();
		tx.insert(teamMember)
			.values(distinct(input.teamIds).map((teamId) => ({ teamId, userId: created.id })))
			.run();
		const token = issueInvitation(tx, created.id, invitedBy, now);
		return { ok: true as const, userId: created.id, token };
	});
}

export function reissueInvitation(
	db: Db,
	userId: string,
	by: string,
	now = Date.now()
): Outcome<{ token: string }> {
	const target = db.select({ id: user.id }).from(user).where(eq(user.id, userId)).get();
	if (!target) return refuse('not-found', 'No such account.');
	return writeTransaction(db, (tx) => ({
		ok: true as const,
		token: issueInvitation(tx, userId, by, now)
	}));
}

function liveInvitation(db: Db, token: string, now: number) {
	return db
		.select({ id: invitation.id, userId: invitation.userId, email: user.email, name: user.name })
		.from(invitation)
		.innerJoin(user, eq(user.id, invitation.userId))
		.where(
			and(
				eq(invitation.tokenHash, hashToken(token)),
				isNull(invitation.usedAt),
				sql`${invitation.expiresAt} > ${now}`,
				eq(user.active, true)
			)
		)
		.get();
}

export function invitationForToken(db: Db, token: string, now = Date.now()) {
	const found = liveInvitation(db, token, now);
	return found ? { email: found.email, name: found.name ?? found.email } : null;
}

export async function acceptInvitation(
	db: Db,
	token: string,
	password: string,
	now = Date.now()
): Promise<Outcome<{ email: string }>> {
	const found = liveInvitation(db, token, now);
	if (!found) return refuse('not-found', 'This link has expired or was already used.');
	const passwordHash = await hashPassword(password);
	return writeTransaction(db, (tx) => {
		// Re-check inside the transaction: two tabs submitting the same link must not both win.
		const claimed = tx
			.update(invitation)
			.set({ usedAt: new Date(now) })
			.where(and(eq(invitation.id, found.id), isNull(invitation.usedAt)))
			.run();
		if (claimed.changes !== 1) return refuse('conflict', 'This link was already used.');
		tx.update(user)
			.set({ passwordHash, sessionVersion: sql`${user.sessionVersion} + 1` })
			.where(eq(user.id, found.userId))
			.run();
		return { ok: true as const, email: found.email };
	});
}

export function assignRoles(db: Db, userId: string, roles: Role[], actorId: string): Outcome {
	if (userId === actorId && !roles.includes('admin')) {
		return refuse('forbidden', 'You cannot take the administrator role from yourself.', 'roles');
	}
	const target = db.select({ id: user.id }).from(user).where(eq(user.id, userId)).get();
	if (!target) return refuse('not-found', 'No such account.');
	writeTransaction(db, (tx) => {
		tx.delete(userRole).where(eq(userRole.userId, userId)).run();
		tx.insert(userRole)
			.values(distinct(roles).map((role) => ({ userId, role })))
			.run();
	});
	return { ok: true };
}

/**
 * Ends every session of the user: the tokens carry the session version they were issued
 * under, and a token of an older version no longer resolves to a user.
 */
export function endSessions(db: Db, userId: string): Outcome {
	const changed = db
		.update(user)
		.set({ sessionVersion: sql`${user.sessionVersion} + 1` })
		.where(eq(user.id, userId))
		.run();
	return changed.changes === 1 ? { ok: true } : refuse('not-found', 'No such account.');
}

/** Deactivating ends the user's sessions at once; reactivating lets them sign in again. */
export function setActive(db: Db, userId: string, active: boolean, actorId: string): Outcome {
	if (userId === actorId && !active) {
		return refuse('forbidden', 'You cannot deactivate your own account.');
	}
	const changed = db
		.update(user)
		.set({ active, sessionVersion: sql`${user.sessionVersion} + 1` })
		.where(eq(user.id, userId))
		.run();
	return changed.changes === 1 ? { ok: true } : refuse('not-found', 'No such account.');
}
