import { desc, eq } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import type { CampaignAction, CampaignState } from '../../workflow';
import type { Db, DbOrTx } from '../db/open';
import { auditEvent, campaign } from '../db/schema';
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

export function auditTrail(db: Db, viewer: SessionUser, campaignId: string) {
	if (!readableCampaign(db, viewer, campaignId)) return undefined;
	return db
		.select()
		.from(auditEvent)
		.where(eq(auditEvent.campaignId, campaignId))
		.orderBy(desc(auditEvent.createdAt))
		.all();
}
