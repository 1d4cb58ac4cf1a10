import { and, eq } from 'drizzle-orm';
import { anchorLabel } from '../../review/anchor';
import type { SessionUser } from '../../roles';
import type { DecisionInput } from '../../schemas/review';
import { verdictRefusal } from '../../workflow';
import { campaignActor } from '../access';
import { writeTransaction, type Db } from '../db/open';
import { campaign, campaignRevision, reviewDecision, reviewNote, user } from '../db/schema';
import { enqueueMail } from '../mail/outbox';
import { refuse, type Outcome } from '../outcome';
import { actorName, recordAudit } from './audit';
import { checkedStep, readableCampaign } from './step';

const VERDICT_WORDS = {
	approve: 'approved',
	return: 'returned for changes',
	decline: 'declined'
} as const;

/**
 * Whether the viewer may decide on the campaign at all, whatever the verdict and the state:
 * the check routes make before they read a decision's body.
 */
export function decisionAccess(db: Db, viewer: SessionUser, campaignId: string): Outcome {
	const c = readableCampaign(db, viewer, campaignId);
	if (!c) return refuse('not-found', 'No such campaign.');
	return verdictRefusal(campaignActor(viewer, c)) ?? { ok: true };
}

/**
 * Records a reviewer's decision on the latest revision. One transaction: a second decision on
 * the same revision finds the state moved on (409), and the unique revision id on decisions
 * holds even across processes.
 */
export function decideRevision(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	input: DecisionInput,
	origin: string
): Outcome {
	try {
		return writeTransaction(db, (tx) => {
			const step = checkedStep(tx, viewer, campaignId, input.verdict);
			if (!step.ok) return step.refusal;
			const c = step.campaign;
			if (input.revision !== c.lastRevision) {
				return refuse(
					'conflict',
					`Revision ${input.revision} is not the latest; revision ${c.lastRevision} is under review.`
				);
			}
			const revision = tx
				.select({ id: campaignRevision.id })
				.from(campaignRevision)
				.where(
					and(eq(campaignRevision.campaignId, c.id), eq(campaignRevision.number, c.lastRevision))
				)
				.get()!;
			const decision = tx
				.insert(reviewDecision)
				.values({
					revisionId: revision.id,
					reviewerId: viewer.id,
					verdict: input.verdict,
					summary: input.summary
				})
				.returning({ id: reviewDecision.id })
				.get();
			if (input.notes.length) {
				tx.insert(reviewNote)
					.values(
						input.notes.map((n) => ({ decisionId: decision.id, anchor: n.anchor, text: n.text }))
					)
					.run();
			}
			tx.update(campaign)
				.set({
					state: step.to,
					updatedAt: new Date(),
					...(input.verdict === 'approve' ? { approvedRevisionId: revision.id } : {})
				})
				.where(eq(campaign.id, c.id))
				.run();
			recordAudit(tx, c, viewer, input.verdict, step.to, c.lastRevision, input.summary);
			const owner = tx.select({ email: user.email }).from(user).where(eq(user.id, c.ownerId)).get();
			if (owner) {
				enqueueMail(tx, {
					kind: `decision-${input.verdict}`,
					to: [owner.email],
					subject: `${c.name}: revision ${c.lastRevision} ${VERDICT_WORDS[input.verdict]}`,
					text: `${actorName(viewer)} ${VERDICT_WORDS[input.verdict]} revision ${c.lastRevision} of “${c.name}”.\n\n${input.summary ? `${input.summary}\n\n` : ''}${input.notes.map((n) => `• ${anchorLabel(n.anchor)}: ${n.text}`).join('\n')}\n\nOpen it: ${origin}/campaigns/${c.id}/revisions/${c.lastRevision}`
				});
			}
			return { ok: true };
		});
	} catch (error) {
		if (
			error instanceof Error &&
			/UNIQUE constraint failed: review_decision\.revision_id/.test(error.message)
		) {
			return refuse('conflict', 'Another reviewer decided on this revision first.');
		}
		throw error;
	}
}
