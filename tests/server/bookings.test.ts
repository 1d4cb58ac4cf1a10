import { isActionFailure } from '@sveltejs/kit';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { facilityDefaults, facilitySchema } from '../../src/lib/schemas/facility';
import { booking, facility } from '../../src/lib/server/db/schema';
import {
	bookableCampaigns,
	changeBooking,
	createBooking,
	createClosure,
	listBookings,
	proposeFor
} from '../../src/lib/server/bookings';
import { createCampaign } from '../../src/lib/server/campaigns';
import { moveCampaign, submitCampaign } from '../../src/lib/server/review';
import * as calendarPage from '../../src/routes/(app)/facilities/[id]/calendar/+page.server';
import * as bookingItem from '../../src/routes/api/v1/bookings/[id]/+server';
import { approvedCampaignWorld } from './campaign-fixtures';
import { callRoute as call } from './call-route';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';
// The demo facility opens Monday to Friday 07:00–19:00 Europe/Berlin; tests book in January 2027
// (UTC+1), seen from a fixed "now" before it.
const NOW = DateTime.fromISO('2026-12-01T00:00', { zone: 'utc' }).toMillis();
const at = (local: string) => DateTime.fromISO(local, { zone: 'Europe/Berlin' }).toJSDate();

function approvedWorld() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const { operator, campaignId } = w;
	const book = (start: string, end: string) =>
		createBooking(
			db,
			operator,
			w.tunnel,
			{ campaignId, start: at(start), end: at(end), note: '' },
			ORIGIN,
			NOW
		);
	return { db, w, operator, campaignId, book };
}

describe('booking rules', () => {
	it('answers a draft the booker may not see as it answers an id that does not exist', () => {
		const { db, w, operator } = approvedWorld();
		const draft = createCampaign(db, w.aeroA, w.input());
		if (!draft.ok) throw new Error(draft.message);
		const bookCampaign = (campaignId: string) =>
			createBooking(
				db,
				operator,
				w.tunnel,
				{ campaignId, start: at('2027-01-04T08:00'), end: at('2027-01-04T12:00'), note: '' },
				ORIGIN,
				NOW
			);
		const unseen = bookCampaign(draft.id);
		expect(unseen).toEqual(bookCampaign('00000000-0000-4000-8000-000000000000'));
		expect(unseen).toMatchObject({ ok: false, code: 'invalid', field: 'campaignId' });
	});

	it('allows touching slots and refuses a one-second overlap, naming the slot it collides with', () => {
		const { book } = approvedWorld();
		const first = book('2027-01-04T08:00', '2027-01-04T12:00');
		expect(first.ok).toBe(true);
		expect(book('2027-01-04T12:00', '2027-01-04T15:00').ok).toBe(true);
		const clash = book('2027-01-04T14:59:59', '2027-01-04T16:00');
		expect(clash).toMatchObject({ ok: false, code: 'conflict' });
		expect(!clash.ok && clash.message).toMatch(
			/collides with booking [\w-]+ \(2027-01-04 11:00 UTC/
		);
		expect(book('2027-01-04T07:59:59', '2027-01-04T08:00:01')).toMatchObject({
			ok: false,
			code: 'conflict'
		});
	});

	it('refuses slots outside opening hours, in the past, over a closure, or of zero length', () => {
		const { db, operator, w, book } = approvedWorld();
		expect(book('2027-01-04T06:00', '2027-01-04T08:00')).toMatchObject({
			code: 'invalid',
			message: expect.stringMatching(/opening hours/)
		});
		expect(book('2027-01-09T09:00', '2027-01-09T10:00')).toMatchObject({ code: 'invalid' }); // a Saturday
		expect(book('2026-11-30T09:00', '2026-11-30T10:00')).toMatchObject({
			code: 'invalid',
			message: 'The slot starts in the past.'
		});
		expect(book('2027-01-05T09:00', '2027-01-05T09:00')).toMatchObject({ code: 'invalid' });
		expect(
			createClosure(db, operator, w.tunnel, {
				kind: 'calibration',
				reason: 'Balance calibration',
				start: at('2027-01-06T07:00'),
				end: at('2027-01-06T19:00')
			}).ok
		).toBe(true);
		expect(book('2027-01-06T10:00', '2027-01-06T11:00')).toMatchObject({
			code: 'conflict',
			message: expect.stringMatching(/closed then: Balance calibration/)
		});
		expect(db.select().from(booking).all()).toEqual([]);
	});

	it('books only approved revisions, and keeps slots tied to the approved revision when a new one is drafted', () => {
		const { db, w, operator, campaignId, book } = approvedWorld();
		const draft = createCampaign(db, w.aeroA, { ...w.input(), name: 'Not yet approved' });
		if (!draft.ok) throw new Error(draft.message);
		// Submitted, so staff see it; not approved, so it cannot be booked.
		submitCampaign(db, w.aeroA, draft.id, ORIGIN);
		expect(
			createBooking(
				db,
				operator,
				w.tunnel,
				{
					campaignId: draft.id,
					start: at('2027-01-04T08:00'),
					end: at('2027-01-04T09:00'),
					note: ''
				},
				ORIGIN,
				NOW
			)
		).toMatchObject({ code: 'conflict' });

		expect(book('2027-01-04T08:00', '2027-01-04T12:00').ok).toBe(true);
		const [waiting] = bookableCampaigns(db, w.tunnel);
		expect(waiting).toMatchObject({ id: campaignId, booked_s: 4 * 3600 });
		expect(waiting!.occupancy_s).toBeGreaterThan(waiting!.booked_s);
		expect(moveCampaign(db, w.aeroA, campaignId, 'revise')).toMatchObject({ ok: true });
		const [entry] = listBookings(
			db,
			operator,
			w.tunnel,
			at('2027-01-01T00:00'),
			at('2027-02-01T00:00')
		);
		expect(entry).toMatchObject({ stale: true, campaignName: w.input().name });
		// Hours × rate in decimals: 4 h at the facility's 780.00 per hour.
		expect(entry!.cost).toBe('3120.00');
	});

	it('lets only operators and admins book, and hides other teams’ campaigns from aerodynamicists', () => {
		const { db, w, book } = approvedWorld();
		expect(
			createBooking(
				db,
				w.aeroA,
				w.tunnel,
				{ campaignId: 'x', start: at('2027-01-04T08:00'), end: at('2027-01-04T09:00'), note: '' },
				ORIGIN,
				NOW
			)
		).toMatchObject({ code: 'forbidden' });
		book('2027-01-04T08:00', '2027-01-04T12:00');
		const [seenByOtherTeam] = listBookings(
			db,
			w.aeroB,
			w.tunnel,
			at('2027-01-01T00:00'),
			at('2027-02-01T00:00')
		);
		expect(seenByOtherTeam).toMatchObject({ campaignName: null, campaignId: '', cost: null });
		const [seenByOwner] = listBookings(
			db,
			w.aeroA,
			w.tunnel,
			at('2027-01-01T00:00'),
			at('2027-02-01T00:00')
		);
		expect(seenByOwner!.campaignName).toBe(w.input().name);
	});

	it('moves, confirms, completes and cancels slots by the state rules', () => {
		const { db, operator, book } = approvedWorld();
		const a = book('2027-01-04T08:00', '2027-01-04T10:00');
		const b = book('2027-01-04T10:00', '2027-01-04T12:00');
		if (!a.ok || !b.ok) throw new Error('setup');
		expect(
			changeBooking(db, operator, b.id, { start: at('2027-01-04T09:00') }, 'any', ORIGIN, NOW)
		).toMatchObject({ code: 'conflict' });
		expect(
			changeBooking(
				db,
				operator,
				b.id,
				{ start: at('2027-01-04T13:00'), end: at('2027-01-04T15:00') },
				'any',
				ORIGIN,
				NOW
			)
		).toMatchObject({ ok: true });
		expect(
			changeBooking(db, operator, a.id, { state: 'confirmed' }, 'any', ORIGIN, NOW)
		).toMatchObject({ ok: true });
		expect(
			changeBooking(db, operator, a.id, { state: 'completed' }, 'any', ORIGIN, NOW)
		).toMatchObject({ ok: true });
		expect(
			changeBooking(db, operator, a.id, { state: 'cancelled' }, 'any', ORIGIN, NOW)
		).toMatchObject({
			code: 'conflict'
		});
		expect(
			changeBooking(db, operator, b.id, { state: 'cancelled' }, 'any', ORIGIN, NOW)
		).toMatchObject({ ok: true });
		// A cancelled slot frees its time.
		expect(book('2027-01-04T13:00', '2027-01-04T15:00').ok).toBe(true);
	});

	it('proposes the first free time that holds the campaign, around slots and closures', () => {
		const { db, w, operator, book } = approvedWorld();
		book('2027-01-04T07:00', '2027-01-04T12:00');
		createClosure(db, operator, w.tunnel, {
			kind: 'holiday',
			reason: 'Site holiday',
			start: at('2027-01-05T00:00'),
			end: at('2027-01-06T00:00')
		});
		const proposal = proposeFor(db, w.tunnel, 10 * 3600, at('2027-01-04T07:00').getTime());
		if (!proposal.ok) throw new Error(proposal.message);
		expect(
			proposal.slots.map((s) => [new Date(s.start).toISOString(), new Date(s.end).toISOString()])
		).toEqual([
			['2027-01-04T11:00:00.000Z', '2027-01-04T18:00:00.000Z'],
			['2027-01-06T06:00:00.000Z', '2027-01-06T09:00:00.000Z']
		]);
	});

	it('cuts proposals by the facility’s minimum slot and step, and each one can be booked', () => {
		const { db, w, book } = approvedWorld();
		// Rule values for this test: no slot under 2 h, on the half hours of the tunnel's clock.
		db.update(facility)
			.set({ minimumSlot_s: 2 * 3600, slotStep_s: 30 * 60 })
			.run();
		book('2027-01-04T07:00', '2027-01-04T12:10');
		const local = (t: number) =>
			DateTime.fromMillis(t, { zone: 'Europe/Berlin' }).toFormat('ccc HH:mm');
		// 7 h 40 min rounds up to 8 h. Monday's free 12:30–19:00 would leave 1 h 30 min for Tuesday,
		// under the minimum, so Monday stops at 18:30 and Tuesday gets the 2 h minimum.
		const proposal = proposeFor(db, w.tunnel, 7 * 3600 + 40 * 60, at('2027-01-04T07:00').getTime());
		if (!proposal.ok) throw new Error(proposal.message);
		expect(proposal.slots.map((s) => [local(s.start), local(s.end)])).toEqual([
			['Mon 12:30', 'Mon 18:30'],
			['Tue 07:00', 'Tue 09:00']
		]);
		for (const slot of proposal.slots) {
			const booked = book(
				DateTime.fromMillis(slot.start, { zone: 'Europe/Berlin' }).toISO()!,
				DateTime.fromMillis(slot.end, { zone: 'Europe/Berlin' }).toISO()!
			);
			expect(booked.ok).toBe(true);
		}
	});

	it('refuses a proposal the time does not fit, saying why', () => {
		const { db, w } = approvedWorld();
		db.update(facility)
			.set({ minimumSlot_s: 2 * 3600, slotStep_s: 15 * 60 })
			.run();
		expect(proposeFor(db, w.tunnel, 45 * 60, at('2027-01-04T07:00').getTime())).toMatchObject({
			ok: false,
			code: 'conflict',
			message: expect.stringMatching(/45 min still to book does not fit .* 2 h 00 min/)
		});
	});
});

describe('facility slot settings', () => {
	it('default to a 1 h minimum slot on a 15 min step, and take the step in whole minutes', () => {
		const { minimumSlot_s: _, slotStep_s: __, ...older } = facilityDefaults();
		expect(facilitySchema.parse({ ...older, name: 'T' })).toMatchObject({
			minimumSlot_s: 3600,
			slotStep_s: 900
		});
		const seconds = facilitySchema.safeParse({ ...facilityDefaults(), name: 'T', slotStep_s: 90 });
		expect(seconds.success).toBe(false);
		expect(seconds.error?.issues[0]).toMatchObject({
			path: ['slotStep_s'],
			message: 'Use whole minutes.'
		});
	});
});

describe('a booking change names the version it read', () => {
	it('refuses a PATCH without If-Match (428) and a stale one (412, naming the change)', async () => {
		const { db, operator, book } = approvedWorld();
		const slot = book('2027-01-04T08:00', '2027-01-04T10:00');
		if (!slot.ok) throw new Error(slot.message);
		const patch = (body: unknown, ifMatch?: string) =>
			call(bookingItem.PATCH, db, operator, {
				method: 'PATCH',
				params: { id: slot.id },
				body,
				headers: ifMatch ? { 'if-match': ifMatch } : {}
			});
		expect((await patch({ note: 'blind' })).status).toBe(428);
		const confirmed = await patch({ state: 'confirmed' }, '"1"');
		expect(confirmed.status).toBe(200);
		expect(confirmed.headers.get('etag')).toBe('"2"');
		const late = await patch({ note: 'late' }, '"1"');
		expect(late.status).toBe(412);
		expect(late.body.error.stale.changes).toEqual([
			{ field: 'state', label: 'State', before: 'pencilled', after: 'confirmed' }
		]);
	});

	it('answers a stale step on the calendar 409, saying who changed what', async () => {
		const { db, w, operator, book } = approvedWorld();
		const slot = book('2027-01-04T08:00', '2027-01-04T10:00');
		if (!slot.ok) throw new Error(slot.message);
		expect(
			changeBooking(db, operator, slot.id, { state: 'confirmed' }, 1, ORIGIN, NOW)
		).toMatchObject({ ok: true, version: 2 });
		const request = new Request(`${ORIGIN}/facilities/${w.tunnel}/calendar?/change`, {
			method: 'POST',
			body: new URLSearchParams({ bookingId: slot.id, state: 'cancelled', baseVersion: '1' })
		});
		const result = await calendarPage.actions.change!({
			request,
			url: new URL(request.url),
			params: { id: w.tunnel },
			locals: { db, user: operator, apiToken: null }
		} as never);
		expect(isActionFailure(result) && result.status).toBe(409);
		expect((result as { data: { stepError: string } }).data.stepError).toMatch(
			/saved this at .* state pencilled → confirmed/
		);
	});
});
