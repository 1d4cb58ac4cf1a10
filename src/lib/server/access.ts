import { gt, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { SessionUser } from '../roles';
import type { ApiTokenScope } from '../schemas/api-token';
import type { CampaignState } from '../workflow';
import { campaign } from './db/schema';

/**
 * Who may see and change what. Clients' work is confidential from each other, so team
 * membership gates every model and campaign; facility staff read campaigns once submitted.
 */
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

export function canWriteModel(viewer: SessionUser, model: { teamId: string }): boolean {
	return canReadModel(viewer, model);
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
 * in tests/server/campaigns.test.ts).
 */
export function readableCampaigns(viewer: SessionUser): SQL | undefined {
	if (isAdmin(viewer)) return undefined;
	const staff = viewer.roles.includes('reviewer') || viewer.roles.includes('operator');
	const teamIds = viewer.roles.includes('aerodynamicist') ? viewer.teams.map((t) => t.id) : [];
	return or(
		teamIds.length ? inArray(campaign.teamId, teamIds) : sql`0`,
		staff ? gt(campaign.lastRevision, 0) : sql`0`
	);
}

/** Only the owner edits, and only while the campaign is a draft. */
export function canEditCampaign(viewer: SessionUser, c: CampaignAccessFacts): boolean {
	return (
		c.state === 'draft' &&
		c.ownerId === viewer.id &&
		viewer.roles.includes('aerodynamicist') &&
		inTeam(viewer, c.teamId)
	);
}

export function canEditFacilities(viewer: SessionUser): boolean {
	return isAdmin(viewer) || viewer.roles.includes('operator');
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
