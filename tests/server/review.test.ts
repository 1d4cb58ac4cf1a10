import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { diffRevisions } from '../../src/lib/review/diff';
import { campaign, mailOutbox, reviewDecision } from '../../src/lib/server/db/schema';
import { createCampaign, getCampaignFor, updateCampaign } from '../../src/lib/server/campaigns';
import {
	auditTrail,
	decideRevision,
	getRevision,
	listRevisions,
	moveCampaign,
	returnNotes,
	reviewQueue,
	submitCampaign
} from '../../src/lib/server/review';
import type { SessionUser } from '../../src/lib/roles';
import { addUser } from './temp-db';
import { campaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';

function started() {
	const db = tempDb();
	const w = campaignWorld(db);
	const created = createCampaign(db, w.aeroA, w.input());
	if (!created.ok) throw new Error(created.message);
	const reviewer2: SessionUser = {
		...w.reviewer,
		id: addUser(db, 'r2@example.org', ['reviewer']),
		email: 'r2@example.org'
	};
	return { db, w, id: created.id, reviewer2 };
}

describe('submitting', () => {
	it('freezes a numbered revision, queues it, tells the reviewers and writes the audit trail', () => {
		const { db, w, id } = started();
		expect(submitCampaign(db, w.aeroA, id, ORIGIN)).toEqual({ ok: true, revision: 1 });
		const revision = getRevision(db, w.reviewer, id, 1)!;
		expect(revision.snapshot.definition.speeds_mps).toEqual(w.input().speeds_mps);
		expect(revision.snapshot.figures.occupancy.counts.points).toBe(180);
		expect(reviewQueue(db, w.reviewer).map((q) => q.id)).toEqual([id]);
		const mail = db.select().from(mailOutbox).all();
		expect(mail.map((m) => [m.kind, [...m.to].sort()])).toEqual([
			['review-requested', ['r2@example.org', 'r@example.org']]
		]);
		expect(mail[0]!.text).toContain(`${ORIGIN}/campaigns/${id}/revisions/1`);
		expect(
			auditTrail(db, w.aeroA, id)!.map((e) => [e.action, e.fromState, e.toState, e.revisionNumber])
		).toEqual([['submit', 'draft', 'in-review', 1]]);
	});

	it('is for the owner only, and locks the draft while it is in review', () => {
		const { db, w, id } = started();
		expect(submitCampaign(db, w.aeroA2, id, ORIGIN)).toMatchObject({
			ok: false,
			code: 'forbidden'
		});
		expect(submitCampaign(db, w.aeroB, id, ORIGIN)).toMatchObject({ ok: false, code: 'not-found' });
		submitCampaign(db, w.aeroA, id, ORIGIN);
		expect(submitCampaign(db, w.aeroA, id, ORIGIN)).toMatchObject({ ok: false, code: 'conflict' });
		expect(updateCampaign(db, w.aeroA, id, w.input(), 1)).toMatchObject({
			ok: false,
			code: 'conflict',
			message: expect.stringMatching(/only a draft/i)
		});
		expect(updateCampaign(db, w.aeroA2, id, w.input(), 1)).toMatchObject({
			ok: false,
			code: 'forbidden'
		});
	});
});

describe('deciding', () => {
	it('lets exactly one of two reviewers decide a revision; the other gets a conflict', () => {
		const { db, w, id, reviewer2 } = started();
		submitCampaign(db, w.aeroA, id, ORIGIN);
		const first = decideRevision(
			db,
			w.reviewer,
			id,
			{ revision: 1, verdict: 'approve', summary: '', notes: [] },
			ORIGIN
		);
		const second = decideRevision(
			db,
			reviewer2,
			id,
			{ revision: 1, verdict: 'decline', summary: 'No.', notes: [] },
			ORIGIN
		);
		expect(first).toEqual({ ok: true });
		expect(second).toMatchObject({ ok: false, code: 'conflict' });
		expect(db.select().from(reviewDecision).all()).toHaveLength(1);
		expect(getCampaignFor(db, w.admin, id)!.state).toBe('approved');
	});

	it('keeps a second decision out even when the state check is bypassed', () => {
		const { db, w, id, reviewer2 } = started();
		submitCampaign(db, w.aeroA, id, ORIGIN);
		decideRevision(
			db,
			w.reviewer,
			id,
			{ revision: 1, verdict: 'approve', summary: '', notes: [] },
			ORIGIN
		);
		// As if another process had read the campaign before the first decision committed.
		db.update(campaign).set({ state: 'in-review' }).where(eq(campaign.id, id)).run();
		expect(
			decideRevision(
				db,
				reviewer2,
				id,
				{ revision: 1, verdict: 'return', summary: 'x', notes: [] },
				ORIGIN
			)
		).toMatchObject({
			ok: false,
			code: 'conflict',
			message: 'Another reviewer decided on this revision first.'
		});
	});

	it('refuses the owner, other roles, and a stale revision number', () => {
		const { db, w, id } = started();
		submitCampaign(db, w.aeroA, id, ORIGIN);
		const ownerAsReviewer: SessionUser = { ...w.aeroA, roles: ['aerodynamicist', 'reviewer'] };
		expect(
			decideRevision(
				db,
				ownerAsReviewer,
				id,
				{ revision: 1, verdict: 'approve', summary: '', notes: [] },
				ORIGIN
			)
		).toMatchObject({ code: 'forbidden' });
		const approval = { revision: 1, verdict: 'approve' as const, summary: '', notes: [] };
		// A teammate may read the campaign but holds no reviewer role; another team cannot see it.
		expect(decideRevision(db, w.aeroA2, id, approval, ORIGIN)).toMatchObject({ code: 'forbidden' });
		expect(decideRevision(db, w.aeroB, id, approval, ORIGIN)).toMatchObject({ code: 'not-found' });
		expect(
			decideRevision(
				db,
				w.reviewer,
				id,
				{ revision: 2, verdict: 'approve', summary: '', notes: [] },
				ORIGIN
			)
		).toMatchObject({ code: 'conflict' });
	});

	it('returns a campaign with pinned notes; the next revision shows what changed; approval survives a revision', () => {
		const { db, w, id } = started();
		submitCampaign(db, w.aeroA, id, ORIGIN);
		const pinned = { anchor: { kind: 'speed' as const, speed_mps: 55 }, text: 'Drop 55 m/s.' };
		expect(
			decideRevision(
				db,
				w.reviewer,
				id,
				{ revision: 1, verdict: 'return', summary: 'Nearly.', notes: [pinned] },
				ORIGIN
			)
		).toEqual({ ok: true });
		expect(getCampaignFor(db, w.aeroA, id)!.state).toBe('draft');
		expect(returnNotes(db, w.aeroA, id)).toMatchObject({
			revision: 1,
			summary: 'Nearly.',
			notes: [pinned]
		});
		expect(db.select().from(mailOutbox).all().at(-1)).toMatchObject({
			kind: 'decision-return',
			to: ['a@example.org']
		});

		const fixed = {
			...w.input(),
			speeds_mps: w.input().speeds_mps.filter((v) => v !== 55),
			yawAngles_deg: [0, 5]
		};
		expect(updateCampaign(db, w.aeroA, id, fixed, 'any')).toMatchObject({ ok: true });
		expect(submitCampaign(db, w.aeroA, id, ORIGIN)).toEqual({ ok: true, revision: 2 });
		const diff = diffRevisions(
			getRevision(db, w.reviewer, id, 1)!.snapshot,
			getRevision(db, w.reviewer, id, 2)!.snapshot
		);
		expect(diff.speeds_mps).toEqual({ added: [], removed: [55], changed: [] });
		expect(diff.yawAngles_deg).toEqual({ added: [5], removed: [], changed: [] });
		expect(diff.points).toEqual({ before: 180, after: 320 });

		expect(
			decideRevision(
				db,
				w.reviewer,
				id,
				{ revision: 2, verdict: 'approve', summary: '', notes: [] },
				ORIGIN
			)
		).toEqual({ ok: true });
		const approved = getCampaignFor(db, w.aeroA, id)!;
		expect(moveCampaign(db, w.aeroA, id, 'revise')).toEqual({ ok: true });
		const reopened = getCampaignFor(db, w.aeroA, id)!;
		expect(reopened.state).toBe('draft');
		expect(reopened.approvedRevisionId).toBe(approved.approvedRevisionId);
		expect(listRevisions(db, w.aeroA, id)!.map((r) => [r.number, r.verdict])).toEqual([
			[1, 'return'],
			[2, 'approve']
		]);
		expect(
			auditTrail(db, w.admin, id)!
				.map((e) => e.action)
				.reverse()
		).toEqual(['submit', 'return', 'submit', 'approve', 'revise']);
	});
});
