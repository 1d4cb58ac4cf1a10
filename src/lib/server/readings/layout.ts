import { eq } from 'drizzle-orm';
import { CalcInputError, runLayout, type MatrixPlan, type RunLayout } from '../../calc';
import { campaignPlan } from '../../campaign/plan';
import type { RevisionSnapshot } from '../../review/types';
import type { SessionUser } from '../../roles';
import { canReadCampaign } from '../access';
import type { DbOrTx } from '../db/open';
import { campaign, campaignRevision } from '../db/schema';
import { refuse, type Outcome, type Refusal } from '../outcome';

type Campaign = typeof campaign.$inferSelect;

/** The campaign if the viewer may read it; one not to be read is as good as missing. */
export function readableCampaign(
	db: DbOrTx,
	viewer: SessionUser,
	campaignId: string
): Outcome<{ campaign: Campaign }> {
	const c = db.select().from(campaign).where(eq(campaign.id, campaignId)).get();
	if (!c || !canReadCampaign(viewer, c)) return refuse('not-found', 'No such campaign.');
	return { ok: true, campaign: c };
}

/**
 * The approved matrix readings attach to, or a conflict saying `withoutApproval` while the
 * campaign has no approved revision.
 */
export function approvedLayoutOf(
	db: DbOrTx,
	c: Campaign,
	withoutApproval: string
): ApprovedLayout | Refusal {
	if (!c.approvedRevisionId) return refuse('conflict', withoutApproval);
	return approvedLayout(db, c.approvedRevisionId);
}

export type ApprovedLayout = {
	ok: true;
	revisionId: string;
	revisionNumber: number;
	snapshot: RevisionSnapshot;
	plan: MatrixPlan;
	layout: RunLayout;
};

// Revisions never change once written, so their layouts can be kept; a few cover the campaigns
// being read back at any one time.
const cache = new Map<string, ApprovedLayout>();
const CACHED_REVISIONS = 16;

/** The matrix of a frozen revision, as its snapshot's definition, model and facility give it. */
export function approvedLayout(db: DbOrTx, revisionId: string): ApprovedLayout | Refusal {
	const hit = cache.get(revisionId);
	if (hit) return hit;
	const revision = db
		.select()
		.from(campaignRevision)
		.where(eq(campaignRevision.id, revisionId))
		.get();
	if (!revision) return refuse('not-found', 'The approved revision is missing.');
	const { definition, model, facility } = revision.snapshot;
	let plan: MatrixPlan;
	try {
		// The correction the revision was approved with, whatever defaults have changed since.
		plan = {
			...campaignPlan(definition, model, facility).plan,
			dynamicPressureFactor: revision.snapshot.figures.dynamicPressureFactor
		};
	} catch (error) {
		if (!(error instanceof CalcInputError)) throw error;
		return refuse(
			'conflict',
			`The approved revision's matrix cannot be computed: ${error.message}`
		);
	}
	const approved: ApprovedLayout = {
		ok: true,
		revisionId,
		revisionNumber: revision.number,
		snapshot: revision.snapshot,
		plan,
		layout: runLayout(plan)
	};
	if (cache.size >= CACHED_REVISIONS) cache.delete(cache.keys().next().value!);
	cache.set(revisionId, approved);
	return approved;
}
