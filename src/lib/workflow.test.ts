import { describe, expect, it } from 'vitest';
import { ROLES, type Role } from './roles';
import {
	availableActions,
	CAMPAIGN_ACTIONS,
	CAMPAIGN_STATES,
	transition,
	type CampaignAction,
	type CampaignState
} from './workflow';

/**
 * The workflow as the product owner wrote it (issue: review and approval), listed here by hand
 * rather than derived from TRANSITIONS: [state, action, role, acting as owner?, next state].
 */
const ALLOWED: [CampaignState, CampaignAction, Role, boolean, CampaignState][] = [
	['draft', 'submit', 'aerodynamicist', true, 'in-review'],
	['in-review', 'withdraw', 'aerodynamicist', true, 'draft'],
	['in-review', 'approve', 'reviewer', false, 'approved'],
	['in-review', 'return', 'reviewer', false, 'draft'],
	['in-review', 'decline', 'reviewer', false, 'declined'],
	['approved', 'revise', 'aerodynamicist', true, 'draft']
];

// Which role and ownership each action needs, whatever the state.
const NEEDS: Record<CampaignAction, [Role, boolean]> = {
	submit: ['aerodynamicist', true],
	withdraw: ['aerodynamicist', true],
	approve: ['reviewer', false],
	return: ['reviewer', false],
	decline: ['reviewer', false],
	revise: ['aerodynamicist', true]
};

describe('campaign workflow, every state × action × role × ownership', () => {
	const cases = CAMPAIGN_STATES.flatMap((state) =>
		CAMPAIGN_ACTIONS.flatMap((action) =>
			ROLES.flatMap((role) =>
				[true, false].map((isOwner) => [state, action, role, isOwner] as const)
			)
		)
	);

	it.each(cases)('%s + %s by %s (owner: %s)', (state, action, role, isOwner) => {
		const result = transition(state, action, { roles: [role], isOwner });
		const allowed = ALLOWED.find(
			([s, a, r, o]) => s === state && a === action && r === role && o === isOwner
		);
		if (allowed) {
			expect(result).toEqual({ ok: true, to: allowed[4] });
			return;
		}
		const [needRole, needOwner] = NEEDS[action];
		const rightActor = role === needRole && isOwner === needOwner;
		expect(result).toMatchObject({ ok: false, code: rightActor ? 'conflict' : 'forbidden' });
	});

	it('never lets a reviewer decide on a campaign they own', () => {
		expect(
			transition('in-review', 'approve', { roles: ['reviewer', 'aerodynamicist'], isOwner: true })
		).toMatchObject({
			ok: false,
			code: 'forbidden',
			message: 'You cannot decide on a campaign you own.'
		});
	});

	it('offers each actor exactly the actions the table allows', () => {
		expect(availableActions('in-review', { roles: ['reviewer'], isOwner: false })).toEqual([
			'approve',
			'return',
			'decline'
		]);
		expect(availableActions('in-review', { roles: ['aerodynamicist'], isOwner: true })).toEqual([
			'withdraw'
		]);
		expect(
			availableActions('declined', {
				roles: ['aerodynamicist', 'reviewer', 'admin'],
				isOwner: true
			})
		).toEqual([]);
	});
});
