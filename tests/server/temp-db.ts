import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach } from 'vitest';
import { migrateDatabase, openDatabase, type Db } from '../../src/lib/server/db/open';
import { team, teamMember, user, userRole } from '../../src/lib/server/db/schema';
import type { Role, TeamKind } from '../../src/lib/roles';

const opened: { db: Db; dir: string }[] = [];

afterEach(() => {
	for (const { db, dir } of opened.splice(0)) {
		db.$client.close();
		rmSync(dir, { recursive: true, force: true });
	}
});

/** A real, migrated SQLite file in a fresh temporary folder, removed after the test. */
export function tempDb(): Db {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-test-'));
	const db = openDatabase(join(dir, 'test.db'));
	migrateDatabase(db);
	opened.push({ db, dir });
	return db;
}

export function addTeam(db: Db, name: string, kind: TeamKind = 'client'): string {
	return db.insert(team).values({ name, kind }).returning({ id: team.id }).get().id;
}

export function addUser(
	db: Db,
	email: string,
	roles: Role[],
	teamIds: string[] = [],
	passwordHash: string | null = null
): string {
	const id = db
		.insert(user)
		.values({ email, name: email.split('@')[0], passwordHash })
		.returning({ id: user.id })
		.get().id;
	if (roles.length)
		db.insert(userRole)
			.values(roles.map((role) => ({ userId: id, role })))
			.run();
	for (const teamId of teamIds) db.insert(teamMember).values({ teamId, userId: id }).run();
	return id;
}
