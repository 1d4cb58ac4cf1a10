import { desc, eq, sql } from 'drizzle-orm';
import { settingFindings } from '../calc';
import type { SessionUser } from '../roles';
import type { CampaignDefinition, CampaignInput } from '../schemas/campaign';
import {
	campaignReadScope,
	can,
	canEditCampaign,
	canReadCampaign,
	ownsCampaign,
	readableCampaigns
} from './access';
import { writeTransaction, type Db, type DbOrTx } from './db/open';
import { preparedPerDatabase } from './db/prepared';
import { campaign, facility, scaleModel, team, user } from './db/schema';
import { getFacility, type Facility } from './facilities';
import { getModelFor, type ScaleModel } from './models';
import { refuse, type Outcome } from './outcome';
import { claimVersion, forgetHistory, type BaseVersion, type StaleRefusal } from './versions';

export type Campaign = typeof campaign.$inferSelect;
export type CampaignListing = Pick<
	Campaign,
	'id' | 'name' | 'state' | 'updatedAt' | 'teamId' | 'ownerId'
> & {
	modelName: string;
	facilityName: string;
	teamName: string;
	ownerName: string;
	definition: CampaignDefinition;
};
export type CampaignDetail = Campaign & {
	model: ScaleModel;
	facility: Facility;
	ownerName: string;
};

const campaignListing = preparedPerDatabase((db) =>
	db
		.select({
			id: campaign.id,
			name: campaign.name,
			state: campaign.state,
			updatedAt: campaign.updatedAt,
			teamId: campaign.teamId,
			ownerId: campaign.ownerId,
			lastRevision: campaign.lastRevision,
			definition: campaign.definition,
			modelName: scaleModel.name,
			facilityName: facility.name,
			teamName: team.name,
			ownerName: user.name
		})
		.from(campaign)
		.innerJoin(scaleModel, eq(scaleModel.id, campaign.modelId))
		.innerJoin(facility, eq(facility.id, campaign.facilityId))
		.innerJoin(team, eq(team.id, campaign.teamId))
		.innerJoin(user, eq(user.id, campaign.ownerId))
		.where(readableCampaigns)
		.orderBy(desc(campaign.updatedAt))
		.prepare()
);

export function listCampaignsFor(db: Db, viewer: SessionUser): CampaignListing[] {
	return campaignListing(db)
		.all(campaignReadScope(viewer))
		.map((c) => ({ ...c, ownerName: c.ownerName ?? '' }));
}

// A campaign's pages and API calls open it by id on every request.
const campaignById = preparedPerDatabase((db) => {
	const id = sql.placeholder('id');
	return {
		campaign: db.select().from(campaign).where(eq(campaign.id, id)).prepare(),
		model: db
			.select({ model: scaleModel, teamName: team.name })
			.from(scaleModel)
			.innerJoin(team, eq(team.id, scaleModel.teamId))
			.where(eq(scaleModel.id, id))
			.prepare(),
		ownerName: db.select({ name: user.name }).from(user).where(eq(user.id, id)).prepare()
	};
});

/** The campaign with its model and facility if the viewer may read it; else undefined (404). */
export function getCampaignFor(
	db: Db,
	viewer: SessionUser,
	id: string
): CampaignDetail | undefined {
	const queries = campaignById(db);
	const row = queries.campaign.get({ id });
	if (!row || !canReadCampaign(viewer, row)) return undefined;
	const model = queries.model.get({ id: row.modelId })!;
	const owner = queries.ownerName.get({ id: row.ownerId });
	return {
		...row,
		model: { ...model.model, teamName: model.teamName },
		facility: getFacility(db, row.facilityId)!,
		ownerName: owner?.name ?? ''
	};
}

function split({ name, objective, modelId, facilityId, ...definition }: CampaignInput) {
	return { name, objective, modelId, facilityId, definition };
}

/**
 * Refuses speeds and yaw angles the chosen facility cannot set, with the core's envelope
 * message; q and Mach limits stay findings for the reviewer.
 */
function facilityMisfit(input: CampaignInput, f: Facility) {
	const misfit = settingFindings(input.speeds_mps, input.yawAngles_deg, f)[0];
	if (!misfit) return null;
	const field = misfit.code === 'yaw-outside-turntable' ? 'yawAngles_deg' : 'speeds_mps';
	return refuse('invalid', `${f.name}: ${misfit.message}`, field);
}

function resolveLinks(db: DbOrTx, viewer: SessionUser, input: CampaignInput) {
	const model = getModelFor(db, viewer, input.modelId);
	if (!model) return refuse('invalid', 'Choose one of your team’s models.', 'modelId');
	const f = getFacility(db, input.facilityId);
	if (!f) return refuse('invalid', 'Choose a facility.', 'facilityId');
	return facilityMisfit(input, f) ?? { ok: true as const, model, facility: f };
}

export function createCampaign(
	db: Db,
	viewer: SessionUser,
	input: CampaignInput
): Outcome<{ id: string }> {
	if (!can(viewer, 'draft-campaigns'))
		return refuse('forbidden', 'Only aerodynamicists draft campaigns.');
	return writeTransaction(db, (tx) => {
		const links = resolveLinks(tx, viewer, input);
		if (!links.ok) return links;
		const { id } = tx
			.insert(campaign)
			.values({
				...split(input),
				teamId: links.model.teamId,
				ownerId: viewer.id,
				updatedBy: viewer.id
			})
			.returning({ id: campaign.id })
			.get();
		return { ok: true, id };
	});
}

/**
 * The campaign if the viewer may change it: not found when they may not read it, forbidden when
 * they read but do not own the draft. Routes ask this before they read a request body.
 */
export function editableCampaign(
	db: DbOrTx,
	viewer: SessionUser,
	id: string
): Outcome<{ campaign: Campaign }> {
	const existing = db.select().from(campaign).where(eq(campaign.id, id)).get();
	if (!existing || !canReadCampaign(viewer, existing))
		return refuse('not-found', 'No such campaign.');
	if (!ownsCampaign(viewer, existing))
		return refuse('forbidden', 'Only the owner can change a draft.');
	// The owner may edit, but not now: the state, not the person, is what refuses.
	if (existing.state !== 'draft')
		return refuse('conflict', `Only a draft can be changed; this campaign is ${existing.state}.`);
	return { ok: true, campaign: existing };
}

/**
 * Writes the draft if `base` is still its stored version: the check and the write are one
 * immediate transaction, so of two writers who read the same version exactly one wins.
 */
export function updateCampaign(
	db: Db,
	viewer: SessionUser,
	id: string,
	input: CampaignInput,
	base: BaseVersion
): Outcome<{ version: number }> | StaleRefusal {
	return writeTransaction(db, (tx) => {
		const editable = editableCampaign(tx, viewer, id);
		if (!editable.ok) return editable;
		const existing = editable.campaign;
		const links = resolveLinks(tx, viewer, input);
		if (!links.ok) return links;
		if (links.model.teamId !== existing.teamId)
			return refuse('invalid', 'The model must belong to the campaign’s team.', 'modelId');
		const claimed = claimVersion(tx, 'campaign', existing, campaignInput(existing), base, {
			by: viewer.id
		});
		if (!claimed.ok) return claimed;
		tx.update(campaign)
			.set({ ...split(input), ...claimed.stamp })
			.where(eq(campaign.id, id))
			.run();
		return { ok: true, version: claimed.stamp.version };
	});
}

export function deleteCampaign(db: Db, viewer: SessionUser, id: string): Outcome {
	return writeTransaction(db, (tx) => {
		const existing = tx.select().from(campaign).where(eq(campaign.id, id)).get();
		if (!existing || !canReadCampaign(viewer, existing))
			return refuse('not-found', 'No such campaign.');
		if (!canEditCampaign(viewer, existing))
			return refuse('forbidden', 'Only the owner can delete a draft.');
		tx.delete(campaign).where(eq(campaign.id, id)).run();
		forgetHistory(tx, 'campaign', id);
		return { ok: true };
	});
}

/** The editable form values of a stored campaign. */
export function campaignInput(c: Campaign): CampaignInput {
	return {
		name: c.name,
		objective: c.objective,
		modelId: c.modelId,
		facilityId: c.facilityId,
		...c.definition
	};
}

/**
 * A campaign as `GET /api/v1/campaigns/:id` answers it: the fields exactly as PUT takes them, and
 * beside them read-only fields whose names the campaign schema does not use, so PUT drops them.
 */
export function campaignResource(c: CampaignDetail) {
	return {
		...campaignInput(c),
		id: c.id,
		state: c.state,
		teamId: c.teamId,
		ownerId: c.ownerId,
		ownerName: c.ownerName,
		modelName: c.model.name,
		facilityName: c.facility.name,
		lastRevision: c.lastRevision,
		approvedRevisionId: c.approvedRevisionId,
		version: c.version,
		createdAt: c.createdAt,
		updatedAt: c.updatedAt
	};
}
