import { eq } from 'drizzle-orm';
import { CalcInputError, runLayout, type MatrixPlan, type RunLayout } from '../../calc';
import { campaignPlan } from '../../campaign/plan';
import type { RevisionSnapshot } from '../../review/types';
import type { DbOrTx } from '../db/open';
import { campaignRevision } from '../db/schema';
import { refuse, type Refusal } from '../outcome';

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
