import { and, eq } from 'drizzle-orm';
import { hashPassword } from '../src/lib/server/auth/password';
import { databasePathFromEnv, migrateDatabase, openDatabase } from '../src/lib/server/db/open';
import { campaignSchema } from '../src/lib/schemas/campaign';
import {
	campaign,
	facility,
	scaleModel,
	team,
	teamMember,
	user,
	userRole
} from '../src/lib/server/db/schema';
import {
	CLIENT_TEAMS,
	DEMO_ACCOUNTS,
	DEMO_CAMPAIGNS,
	DEMO_FACILITIES,
	DEMO_MODELS,
	DEMO_PASSWORD,
	STAFF_TEAM
} from './demo-scenario';

// Idempotent: each row is matched on its natural key and brought back to the scenario's values.
const path = databasePathFromEnv(process.env);
const db = openDatabase(path);
migrateDatabase(db);
const passwordHash = await hashPassword(DEMO_PASSWORD);

db.transaction((tx) => {
	const teamIds = new Map<string, string>();
	for (const [name, kind] of [
		[STAFF_TEAM, 'staff'],
		...CLIENT_TEAMS.map((n) => [n, 'client'] as const)
	] as const) {
		const row = tx
			.insert(team)
			.values({ name, kind })
			.onConflictDoUpdate({ target: team.name, set: { kind } })
			.returning({ id: team.id })
			.get();
		teamIds.set(name, row.id);
	}

	const userIds = new Map<string, string>();
	for (const account of DEMO_ACCOUNTS) {
		const row = tx
			.insert(user)
			.values({ email: account.email, name: account.name, passwordHash })
			.onConflictDoUpdate({
				target: user.email,
				set: { name: account.name, passwordHash, active: true }
			})
			.returning({ id: user.id })
			.get();
		userIds.set(account.email, row.id);
		tx.delete(userRole).where(eq(userRole.userId, row.id)).run();
		tx.insert(userRole)
			.values(account.roles.map((role) => ({ userId: row.id, role })))
			.run();
		tx.delete(teamMember).where(eq(teamMember.userId, row.id)).run();
		tx.insert(teamMember)
			.values({ userId: row.id, teamId: teamIds.get(account.team)! })
			.run();
	}

	for (const values of DEMO_FACILITIES) {
		tx.insert(facility)
			.values(values)
			.onConflictDoUpdate({ target: facility.name, set: values })
			.run();
	}

	const modelIds = new Map<string, { id: string; teamId: string }>();
	for (const { team: teamName, owner, model } of DEMO_MODELS) {
		const teamId = teamIds.get(teamName)!;
		const row = tx
			.insert(scaleModel)
			.values({ ...model, teamId, createdBy: userIds.get(owner) })
			.onConflictDoUpdate({ target: [scaleModel.teamId, scaleModel.name], set: model })
			.returning({ id: scaleModel.id })
			.get();
		modelIds.set(model.name, { id: row.id, teamId });
	}

	const facilityIds = new Map(
		tx
			.select({ id: facility.id, name: facility.name })
			.from(facility)
			.all()
			.map((f) => [f.name, f.id])
	);
	for (const seed of DEMO_CAMPAIGNS) {
		const model = modelIds.get(seed.model)!;
		// Demo campaigns pass the same checks as any other.
		const { name, objective, modelId, facilityId, ...definition } = campaignSchema.parse({
			...seed.input,
			modelId: model.id,
			facilityId: facilityIds.get(seed.facility)!
		});
		const values = {
			name,
			objective,
			modelId,
			facilityId,
			definition,
			teamId: model.teamId,
			ownerId: userIds.get(seed.owner)!
		};
		const existing = tx
			.select({ id: campaign.id })
			.from(campaign)
			.where(and(eq(campaign.teamId, model.teamId), eq(campaign.name, name)))
			.get();
		if (existing) tx.update(campaign).set(values).where(eq(campaign.id, existing.id)).run();
		else tx.insert(campaign).values(values).run();
	}
});

db.$client.close();
console.log(
	`Seeded ${path}: ${DEMO_ACCOUNTS.length} accounts, ${DEMO_FACILITIES.length} facilities, ${DEMO_MODELS.length} models, ${DEMO_CAMPAIGNS.length} campaigns.`
);
