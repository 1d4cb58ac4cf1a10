import { refuse, type Refusal } from './refusal';
import type { Role } from './roles';

/**
 * The review workflow of a campaign, in one table. A draft is submitted for review; a reviewer
 * approves it, returns it to its owner for changes, or declines it. Revising an approved
 * campaign opens a new draft that needs approval again.
 */
export const CAMPAIGN_STATES = ['draft', 'in-review', 'approved', 'declined'] as const;
export type CampaignState = (typeof CAMPAIGN_STATES)[number];

export const CAMPAIGN_ACTIONS = [
	'submit',
	'withdraw',
	'approve',
	'return',
	'decline',
	'revise'
] as const;
export type CampaignAction = (typeof CAMPAIGN_ACTIONS)[number];

/** Decisions a reviewer can take on a submitted revision. */
export const VERDICTS = ['approve', 'return', 'decline'] as const;
export type Verdict = (typeof VERDICTS)[number];

type Rule = {
	from: readonly CampaignState[];
	to: CampaignState;
	role: Role;
	/** `owner`: only the campaign's owner; `not-owner`: anyone but the owner (no self-review). */
	who: 'owner' | 'not-owner';
};

export const TRANSITIONS: Record<CampaignAction, Rule> = {
	submit: { from: ['draft'], to: 'in-review', role: 'aerodynamicist', who: 'owner' },
	withdraw: { from: ['in-review'], to: 'draft', role: 'aerodynamicist', who: 'owner' },
	approve: { from: ['in-review'], to: 'approved', role: 'reviewer', who: 'not-owner' },
	return: { from: ['in-review'], to: 'draft', role: 'reviewer', who: 'not-owner' },
	decline: { from: ['in-review'], to: 'declined', role: 'reviewer', who: 'not-owner' },
	revise: { from: ['approved'], to: 'draft', role: 'aerodynamicist', who: 'owner' }
};

export type TransitionResult = { ok: true; to: CampaignState } | Refusal;

export const ACTION_LABELS: Record<CampaignAction, string> = {
	submit: 'submit for review',
	withdraw: 'withdraw from review',
	approve: 'approve',
	return: 'return for changes',
	decline: 'decline',
	revise: 'start a new revision'
};

type Actor = { roles: readonly Role[]; isOwner: boolean };

/**
 * Whether `actor` holds the role and the relation to the campaign that `action` needs, whatever
 * the campaign's state; null if so, else the refusal.
 */
export function actorRefusal(action: CampaignAction, actor: Actor): Refusal | null {
	const rule = TRANSITIONS[action];
	if (!actor.roles.includes(rule.role))
		return refuse('forbidden', `Only a ${rule.role} can ${ACTION_LABELS[action]}.`);
	if (rule.who === 'owner' && !actor.isOwner)
		return refuse('forbidden', `Only the campaign's owner can ${ACTION_LABELS[action]}.`);
	if (rule.who === 'not-owner' && actor.isOwner)
		return refuse('forbidden', 'You cannot decide on a campaign you own.');
	return null;
}

/** Whether `actor` may give any verdict at all: null if so, else the refusal of the first. */
export function verdictRefusal(actor: Actor): Refusal | null {
	const refusals = VERDICTS.map((v) => actorRefusal(v, actor));
	return refusals.includes(null) ? null : refusals[0]!;
}

/**
 * Whether `actor` may take `action` on a campaign in `state`. Who may act is checked before
 * the state, so a user without the right learns nothing about the campaign's progress.
 */
export function transition(
	state: CampaignState,
	action: CampaignAction,
	actor: Actor
): TransitionResult {
	const refused = actorRefusal(action, actor);
	if (refused) return refused;
	const rule = TRANSITIONS[action];
	if (!rule.from.includes(state))
		return refuse(
			'conflict',
			`Cannot ${ACTION_LABELS[action]} a campaign that is ${state}; it must be ${rule.from.join(' or ')}.`
		);
	return { ok: true, to: rule.to };
}

/** The actions open to `actor` now, for the buttons a page shows (the server checks again). */
export function availableActions(state: CampaignState, actor: Actor): CampaignAction[] {
	return CAMPAIGN_ACTIONS.filter((a) => transition(state, a, actor).ok);
}
