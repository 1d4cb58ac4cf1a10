import { describe, expect, it } from 'vitest';
import { ROLES, type Role, type SessionUser } from '../../src/lib/roles';
import {
	can,
	canBook,
	canDecideCampaign,
	canEditCampaign,
	canEditFacilities,
	canReadCampaign,
	canReadModel,
	canSeeBookingDetails,
	canUploadReadings,
	canWriteModel,
	type CampaignAccessFacts
} from '../../src/lib/server/access';
import type { CampaignState } from '../../src/lib/workflow';

/**
 * Every role and ownership rule of the product as one table, written out by hand from the
 * product's access rules (clients' work is confidential between teams; staff read campaigns once
 * submitted; only owners edit drafts; nobody reviews their own work) rather than derived from
 * access.ts. Each cell is the answer for a record the viewer owns, one of their team owns, and
 * one another team owns: Y allowed, n refused.
 */
const TABLE: Record<string, Record<Role, string>> = {
	'read a model': { aerodynamicist: 'YYn', reviewer: 'nnn', operator: 'nnn', admin: 'YYY' },
	'change a model': { aerodynamicist: 'YYn', reviewer: 'nnn', operator: 'nnn', admin: 'nnn' },
	'read a never-submitted draft': {
		aerodynamicist: 'YYn',
		reviewer: 'nnn',
		operator: 'nnn',
		admin: 'YYY'
	},
	'read a submitted campaign': {
		aerodynamicist: 'YYn',
		reviewer: 'YYY',
		operator: 'YYY',
		admin: 'YYY'
	},
	'edit a draft': { aerodynamicist: 'Ynn', reviewer: 'nnn', operator: 'nnn', admin: 'nnn' },
	'decide on a campaign in review': {
		aerodynamicist: 'nnn',
		reviewer: 'nYY',
		operator: 'nnn',
		admin: 'nnn'
	},
	'send readings for an approved campaign': {
		aerodynamicist: 'YYn',
		reviewer: 'nnn',
		operator: 'YYY',
		admin: 'YYY'
	},
	'see who booked a slot': {
		aerodynamicist: 'YYn',
		reviewer: 'YYY',
		operator: 'YYY',
		admin: 'YYY'
	},
	'book tunnel time': { aerodynamicist: 'nnn', reviewer: 'nnn', operator: 'YYY', admin: 'YYY' },
	'edit facilities': { aerodynamicist: 'nnn', reviewer: 'nnn', operator: 'YYY', admin: 'YYY' },
	'draft campaigns': { aerodynamicist: 'YYY', reviewer: 'nnn', operator: 'nnn', admin: 'nnn' },
	'read the review queue': {
		aerodynamicist: 'nnn',
		reviewer: 'YYY',
		operator: 'nnn',
		admin: 'YYY'
	}
};

const OWN_TEAM = 'team-own';
const OTHER_TEAM = 'team-other';
const OWNERSHIPS = ['own', 'team', 'other'] as const;
type Ownership = (typeof OWNERSHIPS)[number];

function viewerWith(role: Role): SessionUser {
	return {
		id: 'viewer',
		email: 'viewer@example.org',
		name: 'Viewer',
		roles: [role],
		teams: [{ id: OWN_TEAM, name: 'Own team', kind: 'client' }]
	};
}

function campaignOf(
	ownership: Ownership,
	state: CampaignState,
	lastRevision: number
): CampaignAccessFacts & { approvedRevisionId: string | null } {
	return {
		teamId: ownership === 'other' ? OTHER_TEAM : OWN_TEAM,
		ownerId: ownership === 'own' ? 'viewer' : 'someone-else',
		state,
		lastRevision,
		approvedRevisionId: state === 'approved' ? 'revision-1' : null
	};
}

const PREDICATES: Record<string, (viewer: SessionUser, ownership: Ownership) => boolean> = {
	'read a model': (v, o) => canReadModel(v, campaignOf(o, 'draft', 0)),
	'change a model': (v, o) => canWriteModel(v, campaignOf(o, 'draft', 0)),
	'read a never-submitted draft': (v, o) => canReadCampaign(v, campaignOf(o, 'draft', 0)),
	'read a submitted campaign': (v, o) => canReadCampaign(v, campaignOf(o, 'in-review', 1)),
	'edit a draft': (v, o) => canEditCampaign(v, campaignOf(o, 'draft', 0)),
	'decide on a campaign in review': (v, o) => canDecideCampaign(v, campaignOf(o, 'in-review', 1)),
	'send readings for an approved campaign': (v, o) =>
		canUploadReadings(v, campaignOf(o, 'approved', 1)),
	'see who booked a slot': (v, o) => canSeeBookingDetails(v, campaignOf(o, 'approved', 1)),
	'book tunnel time': (v) => canBook(v),
	'edit facilities': (v) => canEditFacilities(v),
	'draft campaigns': (v) => can(v, 'draft-campaigns'),
	'read the review queue': (v) => can(v, 'read-review-queue')
};

describe('access, every role × action × ownership', () => {
	const cases = Object.keys(TABLE).flatMap((action) =>
		ROLES.flatMap((role) => OWNERSHIPS.map((ownership) => [action, role, ownership] as const))
	);

	it.each(cases)('%s by %s (%s record)', (action, role, ownership) => {
		const expected = TABLE[action]![role][OWNERSHIPS.indexOf(ownership)] === 'Y';
		expect(PREDICATES[action]!(viewerWith(role), ownership)).toBe(expected);
	});

	it('never lets a reviewer decide on their own campaign, whatever other roles they hold', () => {
		const both = { ...viewerWith('reviewer'), roles: ['reviewer', 'aerodynamicist', 'admin'] };
		expect(canDecideCampaign(both as SessionUser, campaignOf('own', 'in-review', 1))).toBe(false);
	});

	it('takes readings from nobody before a revision is approved', () => {
		const draft = { ...campaignOf('team', 'draft', 1), approvedRevisionId: null };
		for (const role of ROLES) expect(canUploadReadings(viewerWith(role), draft)).toBe(false);
	});
});
