import { sql, type SQL } from 'drizzle-orm';
import { BOOKING_ROLES } from '../booking/workflow';
import type { Role, SessionUser } from '../roles';
import type { ApiTokenScope } from '../schemas/api-token';
import { verdictRefusal, type CampaignState } from '../workflow';
import { campaign, scaleModel } from './db/schema';

/**
 * Who may see and change what: every role and ownership rule of the product, tested as one
 * table in tests/server/access-table.test.ts. Clients' work is confidential from each other, so
 * team membership gates every model and campaign; facility staff read campaigns once submitted.
 */

/** What a role alone allows, whatever the record; routes check these with requirePermission. */
export const PERMISSIONS = {
	'list-campaigns': ['aerodynamicist', 'reviewer', 'operator', 'admin'],
	'draft-campaigns': ['aerodynamicist'],
	'decide-campaigns': ['reviewer'],
	'read-review-queue': ['reviewer', 'admin'],
	'read-models': ['aerodynamicist', 'admin'],
	'keep-models': ['aerodynamicist'],
	'book-tunnel-time': BOOKING_ROLES,
	'edit-facilities': ['operator', 'admin'],
	'manage-billing': ['operator', 'admin']
} as const satisfies Record<string, readonly Role[]>;
export type Permission = keyof typeof PERMISSIONS;

export function can(viewer: SessionUser, permission: Permission): boolean {
	const roles: readonly Role[] = PERMISSIONS[permission];
	return roles.some((r) => viewer.roles.includes(r));
}

export type CampaignAccessFacts = {
	teamId: string;
	ownerId: string;
	state: CampaignState;
	/** Latest submitted revision; 0 until first submitted. */
	lastRevision: number;
};

const isAdmin = (u: SessionUser) => u.roles.includes('admin');
const inTeam = (u: SessionUser, teamId: string) => u.teams.some((t) => t.id === teamId);

export function canReadModel(viewer: SessionUser, model: { teamId: string }): boolean {
	return (
		isAdmin(viewer) || (viewer.roles.includes('aerodynamicist') && inTeam(viewer, model.teamId))
	);
}

/** A model is kept by its own team's aerodynamicists; admins read every model but keep none. */
export function canWriteModel(viewer: SessionUser, model: { teamId: string }): boolean {
	return can(viewer, 'keep-models') && inTeam(viewer, model.teamId);
}

const readScope = (everything: boolean, teamIds: string[], submitted = false) => ({
	readsAll: everything ? 1 : 0,
	readsTeams: JSON.stringify(teamIds),
	readsSubmitted: submitted ? 1 : 0
});
/** The viewer's facts that `readableModels` and `readableCampaigns` are bound to. */
export type ReadScope = ReturnType<typeof readScope>;

const teamIdsIn = (teamIds: ReturnType<typeof sql.placeholder>) =>
	sql`(SELECT value FROM json_each(${teamIds}))`;

/**
 * canReadModel as a query condition for listings, bound to `modelReadScope(viewer)`: the
 * condition has one shape for every viewer, so the listing is prepared once.
 */
export const readableModels: SQL = sql`(${sql.placeholder('readsAll')} = 1 OR ${scaleModel.teamId} IN ${teamIdsIn(sql.placeholder('readsTeams'))})`;

export function modelReadScope(viewer: SessionUser): ReadScope {
	const aerodynamicist = viewer.roles.includes('aerodynamicist');
	return readScope(isAdmin(viewer), aerodynamicist ? viewer.teams.map((t) => t.id) : []);
}

export function canReadCampaign(viewer: SessionUser, c: CampaignAccessFacts): boolean {
	if (isAdmin(viewer)) return true;
	if (viewer.roles.includes('aerodynamicist') && inTeam(viewer, c.teamId)) return true;
	// Staff see a campaign from its first submission on, its later drafts included.
	const staff = viewer.roles.includes('reviewer') || viewer.roles.includes('operator');
	return staff && c.lastRevision > 0;
}

/**
 * canReadCampaign as a query condition, so listings filter in SQL; the two must agree (tested
 * in tests/server/campaigns.test.ts). Bound to `campaignReadScope(viewer)`, so the listing is
 * prepared once.
 */
export const readableCampaigns: SQL = sql`(${sql.placeholder('readsAll')} = 1
	OR ${campaign.teamId} IN ${teamIdsIn(sql.placeholder('readsTeams'))}
	OR (${sql.placeholder('readsSubmitted')} = 1 AND ${campaign.lastRevision} > 0))`;

export function campaignReadScope(viewer: SessionUser): ReadScope {
	// Staff see a campaign from its first submission on, its later drafts included.
	const staff = viewer.roles.includes('reviewer') || viewer.roles.includes('operator');
	const aerodynamicist = viewer.roles.includes('aerodynamicist');
	return readScope(isAdmin(viewer), aerodynamicist ? viewer.teams.map((t) => t.id) : [], staff);
}

/** Only the owner edits, and only while the campaign is a draft. */
/** The owner, as an aerodynamicist of the campaign's team, whatever state it is in. */
export function ownsCampaign(viewer: SessionUser, c: CampaignAccessFacts): boolean {
	return (
		c.ownerId === viewer.id && viewer.roles.includes('aerodynamicist') && inTeam(viewer, c.teamId)
	);
}

export function canEditCampaign(viewer: SessionUser, c: CampaignAccessFacts): boolean {
	return c.state === 'draft' && ownsCampaign(viewer, c);
}

/** The viewer as the campaign workflow sees them: their roles and whether they own it. */
export function campaignActor(viewer: SessionUser, c: { ownerId: string }) {
	return { roles: viewer.roles, isOwner: c.ownerId === viewer.id };
}

/** Reviewers decide on other people's campaigns only, never on their own. */
export function canDecideCampaign(viewer: SessionUser, c: CampaignAccessFacts): boolean {
	if (!canReadCampaign(viewer, c)) return false;
	return !verdictRefusal(campaignActor(viewer, c));
}

export function canEditFacilities(viewer: SessionUser): boolean {
	return can(viewer, 'edit-facilities');
}

/** Operators and admins book tunnel time, change slots and enter closures. */
export function canBook(viewer: SessionUser): boolean {
	return can(viewer, 'book-tunnel-time');
}

/**
 * Whose booked slot shows its campaign, note and cost: the facility's staff and the campaign's
 * own team. Everyone else sees the time as busy only.
 */
export function canSeeBookingDetails(viewer: SessionUser, slot: { teamId: string }): boolean {
	const staff = canBook(viewer) || viewer.roles.includes('reviewer');
	return staff || inTeam(viewer, slot.teamId);
}

/**
 * Readings come back from the campaign's own team and from the facility's operators, whose
 * acquisition computer posts them; reviewers read them. Only an approved revision takes any.
 */
export function canUploadReadings(
	viewer: SessionUser,
	c: CampaignAccessFacts & { approvedRevisionId: string | null }
): boolean {
	if (!c.approvedRevisionId || !canReadCampaign(viewer, c)) return false;
	return (
		isAdmin(viewer) ||
		viewer.roles.includes('operator') ||
		(viewer.roles.includes('aerodynamicist') && inTeam(viewer, c.teamId))
	);
}

/**
 * Quotes and invoices are read by the facility's staff who issue them and by the client team
 * billed; reviewers judge the test, not its price, and see none.
 */
export function canReadBilling(viewer: SessionUser, doc: { teamId: string }): boolean {
	return can(viewer, 'manage-billing') || actsForClient(viewer, doc);
}

/** The client team answers quotes and pays invoices: the billed team's aerodynamicists. */
export function actsForClient(viewer: SessionUser, doc: { teamId: string }): boolean {
	return viewer.roles.includes('aerodynamicist') && inTeam(viewer, doc.teamId);
}

/**
 * The API routes a personal token may call, and the scope each method needs. Everything else,
 * token management included, takes a signed-in session only, so a leaked token cannot mint
 * more tokens or reach the pages.
 */
const TOKEN_ROUTES = new Map<string, Partial<Record<string, ApiTokenScope>>>([
	['/api/v1/campaigns', { GET: 'campaigns:read' }],
	['/api/v1/campaigns/[id]', { GET: 'campaigns:read' }],
	['/api/v1/campaigns/[id]/matrix', { GET: 'campaigns:read' }],
	['/api/v1/campaigns/[id]/revisions', { GET: 'campaigns:read' }],
	['/api/v1/campaigns/[id]/revisions/[n]', { GET: 'campaigns:read' }],
	['/api/v1/campaigns/[id]/readings', { GET: 'readings:read', POST: 'readings:write' }],
	['/api/v1/campaigns/[id]/results', { GET: 'readings:read' }]
]);

/** The scope a token needs for `method` on SvelteKit route `routeId`; null if tokens are refused. */
export function tokenScopeFor(method: string, routeId: string | null): ApiTokenScope | null {
	return (routeId && TOKEN_ROUTES.get(routeId)?.[method]) || null;
}
