import { and, eq } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import { canUploadReadings } from '../access';
import type { Db } from '../db/open';
import { readingsUpload } from '../db/schema';
import type { Outcome } from '../outcome';
import { readingsCoverage } from './coverage';
import { currentConditions, currentReadings, receivedFiles } from './current';
import { approvedLayoutOf, readableCampaign } from './layout';
import { readingsTemplateCsv } from './template';

export { receiveReadings } from './receive';
export { approvedLayout } from './layout';
export type { ReadingsFile, ReadingsRefusal, ReceiveProgress } from './receive';
export { RUN_CONDITION_TOLERANCES } from './run-conditions';
export { MAX_PROBLEMS_SHOWN } from './problems';
export type {
	ReadingProblem,
	ReadingsCoverage,
	ReceivePhase,
	RunCoverage,
	UploadSummary
} from '../../readings/types';

/** The campaign's approved matrix if the viewer may read the campaign and it has one. */
function readableApproved(db: Db, viewer: SessionUser, campaignId: string) {
	const found = readableCampaign(db, viewer, campaignId);
	if (!found.ok) return found;
	const approved = approvedLayoutOf(
		db,
		found.campaign,
		'The campaign has no approved revision yet, so no readings.'
	);
	return approved.ok ? { ok: true as const, campaign: found.campaign, approved } : approved;
}

/** What the campaign page shows of its readings; null before any revision is approved. */
export function readingsOverview(db: Db, viewer: SessionUser, campaignId: string) {
	const found = readableApproved(db, viewer, campaignId);
	if (!found.ok) return null;
	return {
		revisionNumber: found.approved.revisionNumber,
		coverage: readingsCoverage(db, found.approved),
		uploads: receivedFiles(db, campaignId),
		canUpload: canUploadReadings(viewer, found.campaign)
	};
}

/** `GET /api/v1/campaigns/:id/readings`: a page of current readings, the runs' conditions, coverage. */
export function readingsListing(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	page: { offset: number; limit: number }
) {
	const found = readableApproved(db, viewer, campaignId);
	if (!found.ok) return found;
	const coverage = readingsCoverage(db, found.approved);
	return {
		ok: true as const,
		revision: found.approved.revisionNumber,
		coverage,
		conditions: currentConditions(db, found.approved.revisionId),
		readingCount: coverage.readingCount,
		offset: page.offset,
		limit: page.limit,
		readings: currentReadings(db, found.approved.revisionId, page.offset, page.limit)
	};
}

export function readingsTemplate(
	db: Db,
	viewer: SessionUser,
	campaignId: string
): Outcome<{ csv: string; name: string; revision: number }> {
	const found = readableApproved(db, viewer, campaignId);
	if (!found.ok) return found;
	return {
		ok: true,
		csv: readingsTemplateCsv(found.approved),
		name: found.campaign.name,
		revision: found.approved.revisionNumber
	};
}

/** An uploaded file's stored record, for downloading the original bytes. */
export function readingsUploadFor(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	uploadId: string
) {
	if (!readableCampaign(db, viewer, campaignId).ok) return undefined;
	return db
		.select()
		.from(readingsUpload)
		.where(and(eq(readingsUpload.id, uploadId), eq(readingsUpload.campaignId, campaignId)))
		.get();
}
