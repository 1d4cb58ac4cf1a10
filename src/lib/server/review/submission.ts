import { and, eq } from 'drizzle-orm';
import { CalcInputError } from '../../calc';
import { campaignFigures } from '../../campaign/figures';
import type { RevisionSnapshot } from '../../review/types';
import type { SessionUser } from '../../roles';
import { writeTransaction, type Db, type DbOrTx } from '../db/open';
import { campaign, campaignRevision, facility, scaleModel, user, userRole } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { refuse, type Outcome } from '../outcome';
import { actorName, recordAudit } from './audit';
import { checkedStep } from './step';

function snapshotOf(tx: DbOrTx, c: typeof campaign.$inferSelect): RevisionSnapshot {
	const m = tx.select().from(scaleModel).where(eq(scaleModel.id, c.modelId)).get()!;
	const f = tx.select().from(facility).where(eq(facility.id, c.facilityId)).get()!;
	const figures = campaignFigures(c.definition, m, f);
	return {
		name: c.name,
		objective: c.objective,
		definition: c.definition,
		model: m,
		facility: f,
		figures: {
			speeds: figures.speeds,
			findings: figures.findings,
			occupancy: figures.occupancy,
			cost: figures.cost,
			currency: figures.currency,
			blockageRatio: figures.blockage.ratio,
			dynamicPressureFactor: figures.blockage.dynamicPressureFactor
		}
	};
}

function reviewerAddresses(tx: DbOrTx): string[] {
	return tx
		.select({ email: user.email })
		.from(userRole)
		.innerJoin(user, eq(user.id, userRole.userId))
		.where(and(eq(userRole.role, 'reviewer'), eq(user.active, true)))
		.all()
		.map((r) => r.email);
}

/** Freezes the draft as the next numbered revision and puts it in the reviewers' queue. */
export function submitCampaign(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	origin: string
): Outcome<{ revision: number }> {
	return writeTransaction(db, (tx) => {
		const step = checkedStep(tx, viewer, campaignId, 'submit');
		if (!step.ok) return step.refusal;
		const c = step.campaign;
		let snapshot: RevisionSnapshot;
		try {
			snapshot = snapshotOf(tx, c);
		} catch (error) {
			if (error instanceof CalcInputError)
				return refuse('invalid', `The figures cannot be computed: ${error.message}`);
			throw error;
		}
		const number = c.lastRevision + 1;
		tx.insert(campaignRevision)
			.values({ campaignId: c.id, number, snapshot, submittedBy: viewer.id })
			.run();
		tx.update(campaign)
			.set({ state: step.to, lastRevision: number, updatedAt: new Date() })
			.where(eq(campaign.id, c.id))
			.run();
		recordAudit(tx, c, viewer, 'submit', step.to, number);
		const to = reviewerAddresses(tx).filter((e) => e !== viewer.email);
		if (to.length) {
			enqueueMail(tx, {
				kind: 'review-requested',
				to,
				subject: `For review: ${c.name} (revision ${number})`,
				text: `${actorName(viewer)} submitted revision ${number} of “${c.name}” for review.\n\nOpen it: ${origin}/campaigns/${c.id}/revisions/${number}\n\nPoints: ${snapshot.figures.occupancy.counts.points}; findings: ${snapshot.figures.findings.filter((f) => f.level !== 'info').length} cautions or limits.`
			});
		}
		return { ok: true, revision: number };
	});
}

/** Owner actions that only move the state: withdraw from review, or revise an approved campaign. */
export function moveCampaign(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	action: 'withdraw' | 'revise'
): Outcome {
	return writeTransaction(db, (tx) => {
		const step = checkedStep(tx, viewer, campaignId, action);
		if (!step.ok) return step.refusal;
		tx.update(campaign)
			.set({ state: step.to, updatedAt: new Date() })
			.where(eq(campaign.id, campaignId))
			.run();
		recordAudit(tx, step.campaign, viewer, action, step.to, step.campaign.lastRevision);
		return { ok: true };
	});
}
