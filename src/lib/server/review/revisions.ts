import { and, asc, eq } from 'drizzle-orm';
import type { NoteAnchor, RevisionSnapshot } from '../../review/types';
import type { SessionUser } from '../../roles';
import type { DecisionInput } from '../../schemas/review';
import type { Db } from '../db/open';
import { campaignRevision, reviewDecision, reviewNote, user } from '../db/schema';
import { readableCampaign } from './step';

export type RevisionView = {
	number: number;
	submittedAt: Date;
	submittedByName: string;
	snapshot: RevisionSnapshot;
	decision: {
		verdict: DecisionInput['verdict'];
		summary: string;
		reviewerName: string;
		createdAt: Date;
		notes: { anchor: NoteAnchor; text: string }[];
	} | null;
};

export function listRevisions(db: Db, viewer: SessionUser, campaignId: string) {
	if (!readableCampaign(db, viewer, campaignId)) return undefined;
	return db
		.select({
			number: campaignRevision.number,
			submittedAt: campaignRevision.submittedAt,
			submittedByName: user.name,
			verdict: reviewDecision.verdict
		})
		.from(campaignRevision)
		.innerJoin(user, eq(user.id, campaignRevision.submittedBy))
		.leftJoin(reviewDecision, eq(reviewDecision.revisionId, campaignRevision.id))
		.where(eq(campaignRevision.campaignId, campaignId))
		.orderBy(asc(campaignRevision.number))
		.all();
}

export function getRevision(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	number: number
): RevisionView | undefined {
	if (!readableCampaign(db, viewer, campaignId)) return undefined;
	const row = db
		.select({ revision: campaignRevision, submittedByName: user.name })
		.from(campaignRevision)
		.innerJoin(user, eq(user.id, campaignRevision.submittedBy))
		.where(and(eq(campaignRevision.campaignId, campaignId), eq(campaignRevision.number, number)))
		.get();
	if (!row) return undefined;
	const decision = db
		.select({ d: reviewDecision, reviewerName: user.name })
		.from(reviewDecision)
		.innerJoin(user, eq(user.id, reviewDecision.reviewerId))
		.where(eq(reviewDecision.revisionId, row.revision.id))
		.get();
	const notes = decision
		? db
				.select({ anchor: reviewNote.anchor, text: reviewNote.text })
				.from(reviewNote)
				.where(eq(reviewNote.decisionId, decision.d.id))
				.all()
		: [];
	return {
		number: row.revision.number,
		submittedAt: row.revision.submittedAt,
		submittedByName: row.submittedByName ?? '',
		snapshot: row.revision.snapshot,
		decision: decision
			? {
					verdict: decision.d.verdict,
					summary: decision.d.summary,
					reviewerName: decision.reviewerName ?? '',
					createdAt: decision.d.createdAt,
					notes
				}
			: null
	};
}

/** The notes of the latest decision if it returned the campaign, for showing beside the fields. */
export function returnNotes(db: Db, viewer: SessionUser, campaignId: string) {
	const c = readableCampaign(db, viewer, campaignId);
	if (!c || c.state !== 'draft' || c.lastRevision === 0) return null;
	const latest = getRevision(db, viewer, campaignId, c.lastRevision);
	return latest?.decision?.verdict === 'return'
		? { revision: latest.number, ...latest.decision }
		: null;
}
