/**
 * The review of campaigns: submitting and the owner's moves (`submission.ts`), reviewers'
 * decisions, the frozen revisions and what they say, the audit trail, and the reviewers' queue.
 */
export { auditTrail } from './audit';
export { decideRevision, decisionAccess } from './decisions';
export { reviewQueue } from './queue';
export { getRevision, listRevisions, returnNotes, type RevisionView } from './revisions';
export { moveCampaign, submitCampaign } from './submission';
