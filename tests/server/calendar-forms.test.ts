import { isActionFailure } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import * as calendarPage from '../../src/routes/(app)/facilities/[id]/calendar/+page.server';
import { approvedCampaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';

/** Posts a calendar form as a browser without JavaScript would; answers status and form. */
async function post(
	action: 'book' | 'close',
	db: Db,
	user: SessionUser,
	facilityId: string,
	fields: Record<string, string>
) {
	const request = new Request(`${ORIGIN}/facilities/${facilityId}/calendar?/${action}`, {
		method: 'POST',
		body: new URLSearchParams(fields)
	});
	const result = await calendarPage.actions[action]!({
		request,
		url: new URL(request.url),
		params: { id: facilityId },
		locals: { db, user, apiToken: null }
	} as never);
	const data = (isActionFailure(result) ? result.data : result) as {
		form: { data: Record<string, unknown>; errors: Record<string, string[]>; message?: string };
	};
	return { status: isActionFailure(result) ? result.status : 200, form: data.form };
}

// The demo facility opens Monday to Friday 07:00–19:00 in its own zone, Europe/Berlin; the
// times below are wall-clock times there, as the form's fields send them.
describe('the calendar forms', () => {
	it('books a slot, then keeps the times typed and puts the overlap at the start field', async () => {
		const db = tempDb();
		const w = approvedCampaignWorld(db, ORIGIN);
		const slot = { campaignId: w.campaignId, start: '2027-01-04T08:00', end: '2027-01-04T12:00' };
		const booked = await post('book', db, w.operator, w.tunnel, slot);
		expect(booked.status).toBe(200);
		expect(booked.form.message).toBe('Slot booked.');

		const again = await post('book', db, w.operator, w.tunnel, slot);
		expect(again.status).toBe(409);
		expect(again.form.data).toMatchObject({ start: slot.start, end: slot.end });
		expect(again.form.errors.start?.join(' ')).toMatch(/collides with booking/);
	});

	it('answers field errors for a closure without a reason or with its end first', async () => {
		const db = tempDb();
		const w = approvedCampaignWorld(db, ORIGIN);
		const refused = await post('close', db, w.operator, w.tunnel, {
			kind: 'maintenance',
			reason: '',
			start: '2027-01-05T10:00',
			end: '2027-01-05T09:00'
		});
		expect(refused.status).toBe(400);
		expect(refused.form.errors.reason).toEqual(['Say why the tunnel is closed.']);
		expect(refused.form.errors.end).toEqual(['The closure must end after it starts.']);
		expect(refused.form.data.start).toBe('2027-01-05T10:00');
	});
});
