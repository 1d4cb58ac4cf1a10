import { and, asc, desc, eq } from 'drizzle-orm';
import { CalcInputError } from '../calc';
import { campaignFigures } from '../campaign/figures';
import { anchorLabel } from '../review/anchor';
import type { NoteAnchor, RevisionSnapshot } from '../review/types';
import type { SessionUser } from '../roles';
import type { DecisionInput } from '../schemas/review';
import { transition, type CampaignAction, type CampaignState } from '../workflow';
import { canReadCampaign } from './access';
import type { Db, DbOrTx } from './db/open';
import {
	auditEvent,
	campaign,
	campaignRevision,
	facility,
	reviewDecision,
	reviewNote,
	scaleModel,
	team,
	user,
	userRole
} from './db/schema';
import { enqueueMail } from './mail/outbox';
import { refuse, type Outcome } from './outcome';

type CampaignRow = typeof campaign.$inferSelect;

function actorName(viewer: SessionUser) {
	return viewer.name || viewer.email;
}

function audit(
	tx: DbOrTx,
	c: CampaignRow,
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

/** Loads the campaign for an action and checks the transition table; refusals carry the status. */
function checked(tx: DbOrTx, viewer: SessionUser, campaignId: string, action: CampaignAction) {
	const c = tx.select().from(campaign).where(eq(campaign.id, campaignId)).get();
	if (!c || !canReadCampaign(viewer, c))
		return { ok: false as const, refusal: refuse('not-found', 'No such campaign.') };
	const step = transition(c.state, action, {
		roles: viewer.roles,
		isOwner: c.ownerId === viewer.id
	});
	if (!step.ok)
		return {
			ok: false as const,
			refusal: refuse(step.status === 409 ? 'conflict' : 'forbidden', step.reason)
		};
	return { ok: true as const, campaign: c, to: step.to };
}

function snapshotOf(tx: DbOrTx, c: CampaignRow): RevisionSnapshot {
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
	return db.transaction((tx) => {
		const step = checked(tx, viewer, campaignId, 'submit');
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
		audit(tx, c, viewer, 'submit', step.to, number);
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
	return db.transaction((tx) => {
		const step = checked(tx, viewer, campaignId, action);
		if (!step.ok) return step.refusal;
		tx.update(campaign)
			.set({ state: step.to, updatedAt: new Date() })
			.where(eq(campaign.id, campaignId))
			.run();
		audit(tx, step.campaign, viewer, action, step.to, step.campaign.lastRevision);
		return { ok: true };
	});
}

const VERDICT_WORDS = {
	approve: 'approved',
	return: 'returned for changes',
	decline: 'declined'
} as const;

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
		return db.transaction((tx) => {
			const step = checked(tx, viewer, campaignId, input.verdict);
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
			audit(tx, c, viewer, input.verdict, step.to, c.lastRevision, input.summary);
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

function readable(db: Db, viewer: SessionUser, campaignId: string) {
	const c = db.select().from(campaign).where(eq(campaign.id, campaignId)).get();
	return c && canReadCampaign(viewer, c) ? c : undefined;
}

export function listRevisions(db: Db, viewer: SessionUser, campaignId: string) {
	if (!readable(db, viewer, campaignId)) return undefined;
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
	if (!readable(db, viewer, campaignId)) return undefined;
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
	const c = readable(db, viewer, campaignId);
	if (!c || c.state !== 'draft' || c.lastRevision === 0) return null;
	const latest = getRevision(db, viewer, campaignId, c.lastRevision);
	return latest?.decision?.verdict === 'return'
		? { revision: latest.number, ...latest.decision }
		: null;
}

export function auditTrail(db: Db, viewer: SessionUser, campaignId: string) {
	if (!readable(db, viewer, campaignId)) return undefined;
	return db
		.select()
		.from(auditEvent)
		.where(eq(auditEvent.campaignId, campaignId))
		.orderBy(desc(auditEvent.createdAt))
		.all();
}

/** Campaigns waiting for a decision, oldest submission first. */
export function reviewQueue(db: Db, viewer: SessionUser) {
	if (!viewer.roles.includes('reviewer') && !viewer.roles.includes('admin')) return [];
	return db
		.select({
			id: campaign.id,
			name: campaign.name,
			revision: campaign.lastRevision,
			ownerId: campaign.ownerId,
			ownerName: user.name,
			teamName: team.name,
			facilityName: facility.name,
			submittedAt: campaignRevision.submittedAt,
			snapshot: campaignRevision.snapshot
		})
		.from(campaign)
		.innerJoin(
			campaignRevision,
			and(
				eq(campaignRevision.campaignId, campaign.id),
				eq(campaignRevision.number, campaign.lastRevision)
			)
		)
		.innerJoin(user, eq(user.id, campaign.ownerId))
		.innerJoin(team, eq(team.id, campaign.teamId))
		.innerJoin(facility, eq(facility.id, campaign.facilityId))
		.where(eq(campaign.state, 'in-review'))
		.orderBy(asc(campaignRevision.submittedAt))
		.all()
		.map(({ snapshot, ...q }) => ({
			...q,
			points: snapshot.figures.occupancy.counts.points,
			limits: snapshot.figures.findings.filter((f) => f.level === 'limit').length,
			cautions: snapshot.figures.findings.filter((f) => f.level === 'caution').length,
			ownedByViewer: q.ownerId === viewer.id
		}));
}
