import { isActionFailure, isHttpError, isRedirect } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import { submitCampaign } from '../../src/lib/server/review';
import * as calendarPage from '../../src/routes/(app)/facilities/[id]/calendar/+page.server';
import * as revisionPage from '../../src/routes/(app)/campaigns/[id]/revisions/[n]/+page.server';
import * as modelEditPage from '../../src/routes/(app)/models/[id]/edit/+page.server';
import * as bookingItem from '../../src/routes/api/v1/bookings/[id]/+server';
import * as campaignItem from '../../src/routes/api/v1/campaigns/[id]/+server';
import * as decisions from '../../src/routes/api/v1/campaigns/[id]/decisions/+server';
import * as readings from '../../src/routes/api/v1/campaigns/[id]/readings/+server';
import * as closures from '../../src/routes/api/v1/facilities/[id]/closures/+server';
import * as facilityItem from '../../src/routes/api/v1/facilities/[id]/+server';
import * as modelItem from '../../src/routes/api/v1/models/[id]/+server';
import { createCampaign } from '../../src/lib/server/campaigns';
import { approvedCampaignWorld } from './campaign-fixtures';
import { callRoute as call } from './call-route';
import { tempDb } from './temp-db';

/**
 * Who may touch a record is settled before the body is read: a user without access learns
 * nothing from field errors, only 404 (cannot see it) or 403 (sees it, may not change it).
 */
const ORIGIN = 'http://tunnelwright.test';
const INVALID = { name: '', start: 'not a time', verdict: 'maybe', revision: -1 };

function world() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const draft = createCampaign(db, w.aeroA, w.input());
	if (!draft.ok) throw new Error(draft.message);
	return { db, w, draftId: draft.id };
}

/** A form action called as the framework would, answering the status it would send. */
async function postForm(
	action: (event: never) => unknown,
	db: Db,
	user: SessionUser,
	params: Record<string, string>,
	fields: Record<string, string>
): Promise<number> {
	const request = new Request('http://localhost/form', {
		method: 'POST',
		body: new URLSearchParams(fields)
	});
	try {
		const result = await action({
			request,
			url: new URL(request.url),
			params,
			locals: { db, user, apiToken: null }
		} as never);
		return isActionFailure(result) ? result.status : 200;
	} catch (thrown) {
		if (isHttpError(thrown)) return thrown.status;
		if (isRedirect(thrown)) return thrown.status;
		throw thrown;
	}
}

describe('the API authorizes before it validates the body', () => {
	it('answers a campaign PUT by another team 404 and by a team-mate 403, field errors only to the owner', async () => {
		const { db, w, draftId } = world();
		const params = { id: draftId };
		expect((await call(campaignItem.PUT, db, w.aeroB, { params, body: INVALID })).status).toBe(404);
		expect((await call(campaignItem.PUT, db, w.aeroA2, { params, body: INVALID })).status).toBe(
			403
		);
		const own = await call(campaignItem.PUT, db, w.aeroA, {
			params,
			body: INVALID,
			headers: { 'if-match': '"1"' }
		});
		expect(own.status).toBe(400);
		expect(own.body.error.fields).toBeDefined();
	});

	it('answers a decision on a campaign the reviewer cannot see 404, whatever the body', async () => {
		const { db, w, draftId } = world();
		const params = { id: draftId };
		expect((await call(decisions.POST, db, w.reviewer, { params, body: INVALID })).status).toBe(
			404
		);
		expect(submitCampaign(db, w.aeroA, draftId, ORIGIN).ok).toBe(true);
		expect((await call(decisions.POST, db, w.reviewer, { params, body: INVALID })).status).toBe(
			400
		);
	});

	it('answers 404 for a booking, facility or model that is not there or not theirs', async () => {
		const { db, w } = world();
		const missing = { id: 'no-such-record' };
		for (const [handler, user] of [
			[bookingItem.PATCH, w.operator],
			[closures.POST, w.operator],
			[facilityItem.PUT, w.admin]
		] as const) {
			expect((await call(handler, db, user, { params: missing, body: INVALID })).status).toBe(404);
		}
		const modelOfA = { id: w.modelA };
		expect(
			(await call(modelItem.PUT, db, w.aeroB, { params: modelOfA, body: INVALID })).status
		).toBe(404);
	});

	it('refuses readings from another team before looking at the file', async () => {
		const { db, w } = world();
		const sent = await call(readings.POST, db, w.aeroB, {
			params: { id: w.campaignId },
			raw: 'not readings',
			headers: { 'content-type': 'image/png' }
		});
		expect(sent.status).toBe(404);
	});
});

describe('form actions authorize before they validate the form', () => {
	it('refuses a decision form on an unseen campaign 404', async () => {
		const { db, w, draftId } = world();
		const status = await postForm(
			revisionPage.actions.decide!,
			db,
			w.reviewer,
			{ id: draftId, n: '1' },
			{ verdict: 'maybe' }
		);
		expect(status).toBe(404);
	});

	it('refuses moving a slot that is not on this facility 404, with nonsense times', async () => {
		const { db, w } = world();
		const status = await postForm(
			calendarPage.actions.move!,
			db,
			w.operator,
			{ id: w.tunnel },
			{ bookingId: 'no-such-booking', start: 'soon', end: 'later' }
		);
		expect(status).toBe(404);
	});

	it('refuses editing another team’s model 404 before reading its fields', async () => {
		const { db, w } = world();
		const status = await postForm(
			modelEditPage.actions.default!,
			db,
			w.aeroB,
			{ id: w.modelA },
			{ name: '' }
		);
		expect(status).toBe(404);
	});
});
