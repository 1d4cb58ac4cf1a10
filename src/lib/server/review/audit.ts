import { and, desc, eq, notInArray } from 'drizzle-orm';
import { BILLING_ACTIONS, type BillingAction } from '../../billing/types';
import type { SessionUser } from '../../roles';
import type { CampaignAction, CampaignState } from '../../workflow';
import { canReadBilling } from '../access';
import type { Db, DbOrTx } from '../db/open';
import { auditEvent, campaign, READINGS_ACTIONS } from '../db/schema';
import { readableCampaign } from './step';

export function actorName(viewer: SessionUser) {
	return viewer.name || viewer.email;
}

/** One line of a campaign's audit trail: who moved it from which state to which. */
export function recordAudit(
	tx: DbOrTx,
	c: typeof campaign.$inferSelect,
	viewer: SessionUser,
	action: CampaignAction,
	to: CampaignState,
	revisionNumber: number | null,
	notes = ''
) {
	tx.insert(auditEvent)
		.values({
			campaignId: c.id,
			actorId: viewer.id,
			actorName: actorName(viewer),
			action,
			fromState: c.state,
			toState: to,
			revisionNumber,
			notes
		})
		.run();
}

/** Who an event that moves no state is by: a person, or a service such as the payment service. */
export type EventActor = { id: string | null; name: string };

/** An audit entry that leaves the campaign's state as it is: readings arriving, money moving. */
export function recordCampaignEvent(
	tx: DbOrTx,
	c: { id: string; state: CampaignState },
	actor: EventActor,
	action: (typeof READINGS_ACTIONS)[number] | BillingAction,
	notes: string
) {
	tx.insert(auditEvent)
		.values({
			campaignId: c.id,
			actorId: actor.id,
			actorName: actor.name,
			action,
			fromState: c.state,
			toState: c.state,
			notes
		})
		.run();
}

export function auditTrail(db: Db, viewer: SessionUser, campaignId: string) {
	const c = readableCampaign(db, viewer, campaignId);
	if (!c) return undefined;
	// Prices stay between the facility and the client team, so others' trail leaves them out.
	const shown = canReadBilling(viewer, c)
		? eq(auditEvent.campaignId, campaignId)
		: and(
				eq(auditEvent.campaignId, campaignId),
				notInArray(auditEvent.action, [...BILLING_ACTIONS])
			);
	return db.select().from(auditEvent).where(shown).orderBy(desc(auditEvent.createdAt)).all();
}
