/**
 * The world the intake and reduction benchmarks run in: a fresh database with an approved
 * campaign of the demo's wake survey run twice over, 108 000 points in 180 runs.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createCampaign } from '../src/lib/server/campaigns';
import { migrateDatabase, openDatabase, type Db } from '../src/lib/server/db/open';
import {
	facility,
	scaleModel,
	team,
	teamMember,
	user,
	userRole
} from '../src/lib/server/db/schema';
import { decideRevision, submitCampaign } from '../src/lib/server/review';
import { sessionUser } from '../src/lib/server/users';
import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from './demo-scenario';

const ORIGIN = 'http://localhost';

function person(db: Db, email: string, roles: ('aerodynamicist' | 'reviewer')[], teamId: string) {
	const id = db.insert(user).values({ email, name: email }).returning({ id: user.id }).get().id;
	db.insert(userRole)
		.values(roles.map((role) => ({ userId: id, role })))
		.run();
	db.insert(teamMember).values({ teamId, userId: id }).run();
	return sessionUser(db, id, 1)!;
}

/** An approved campaign of the demo's wake survey, run twice over: 108 000 points. */
export function approvedWorld(db: Db) {
	const client = db.insert(team).values({ name: 'Client', kind: 'client' }).returning().get().id;
	const staff = db.insert(team).values({ name: 'Staff', kind: 'staff' }).returning().get().id;
	const aero = person(db, 'aero@example.org', ['aerodynamicist'], client);
	const reviewer = person(db, 'reviewer@example.org', ['reviewer'], staff);
	const facilityId = db.insert(facility).values(DEMO_FACILITIES[0]!).returning().get().id;
	const modelId = db
		.insert(scaleModel)
		.values({ ...DEMO_MODELS[0]!.model, teamId: client })
		.returning()
		.get().id;
	const created = createCampaign(db, aero, {
		...DEMO_CAMPAIGNS[0]!.input,
		repeats: 2,
		modelId,
		facilityId
	});
	if (!created.ok) throw new Error(created.message);
	submitCampaign(db, aero, created.id, ORIGIN);
	const decided = decideRevision(
		db,
		reviewer,
		created.id,
		{ revision: 1, verdict: 'approve', summary: '', notes: [] },
		ORIGIN
	);
	if (!decided.ok) throw new Error(decided.message);
	return { aero, campaignId: created.id };
}

export function freshDb() {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-bench-'));
	const db = openDatabase(join(dir, 'bench.db'));
	migrateDatabase(db);
	return { db, dir };
}
