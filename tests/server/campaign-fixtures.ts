import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from '../../scripts/demo-scenario';
import type { Role, SessionUser } from '../../src/lib/roles';
import type { CampaignInput } from '../../src/lib/schemas/campaign';
import type { Db } from '../../src/lib/server/db/open';
import { facility, scaleModel } from '../../src/lib/server/db/schema';
import { createCampaign } from '../../src/lib/server/campaigns';
import { decideRevision, submitCampaign } from '../../src/lib/server/review';
import { addTeam, addUser } from './temp-db';

/**
 * Two client teams, staff, one facility and one model per client team. The facility and model
 * values come from the demo scenario: they are inputs here, never check values.
 */
export function campaignWorld(db: Db) {
	const clientA = addTeam(db, 'Client A');
	const clientB = addTeam(db, 'Client B');
	const staff = addTeam(db, 'Staff', 'staff');
	const person = (email: string, roles: Role[], teamId: string): SessionUser => ({
		id: addUser(db, email, roles, [teamId]),
		email,
		name: email,
		roles,
		teams: [
			{
				id: teamId,
				name: teamId === staff ? 'Staff' : teamId === clientA ? 'Client A' : 'Client B',
				kind: teamId === staff ? 'staff' : 'client'
			}
		]
	});
	const aeroA = person('a@example.org', ['aerodynamicist'], clientA);
	const aeroA2 = person('a2@example.org', ['aerodynamicist'], clientA);
	const aeroB = person('b@example.org', ['aerodynamicist'], clientB);
	const reviewer = person('r@example.org', ['reviewer'], staff);
	const admin = person('admin@example.org', ['admin'], staff);
	const tunnel = db
		.insert(facility)
		.values(DEMO_FACILITIES[0]!)
		.returning({ id: facility.id })
		.get().id;
	const modelA = db
		.insert(scaleModel)
		.values({ ...DEMO_MODELS[0]!.model, teamId: clientA })
		.returning({ id: scaleModel.id })
		.get().id;
	const modelB = db
		.insert(scaleModel)
		.values({ ...DEMO_MODELS[2]!.model, teamId: clientB })
		.returning({ id: scaleModel.id })
		.get().id;
	const input = (modelId = modelA): CampaignInput => ({
		...DEMO_CAMPAIGNS[1]!.input,
		modelId,
		facilityId: tunnel
	});
	return { clientA, clientB, aeroA, aeroA2, aeroB, reviewer, admin, tunnel, modelA, modelB, input };
}

/** Drafts a campaign of client A from `input`, submits it and has the reviewer approve it. */
export function approvedCampaign(
	db: Db,
	w: ReturnType<typeof campaignWorld>,
	input: CampaignInput,
	origin: string
): string {
	const created = createCampaign(db, w.aeroA, input);
	if (!created.ok) throw new Error(created.message);
	submitCampaign(db, w.aeroA, created.id, origin);
	const approved = decideRevision(
		db,
		w.reviewer,
		created.id,
		{ revision: 1, verdict: 'approve', summary: '', notes: [] },
		origin
	);
	if (!approved.ok) throw new Error(approved.message);
	return created.id;
}

/** The campaign world with an operator and one campaign of client A submitted and approved. */
export function approvedCampaignWorld(db: Db, origin: string) {
	const w = campaignWorld(db);
	const operator: SessionUser = {
		...w.reviewer,
		id: addUser(db, 'op@example.org', ['operator']),
		email: 'op@example.org',
		roles: ['operator']
	};
	return { ...w, operator, campaignId: approvedCampaign(db, w, w.input(), origin) };
}
