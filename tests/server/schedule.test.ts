import { isHttpError } from '@sveltejs/kit';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { DEMO_FACILITIES } from '../../scripts/demo-scenario';
import { changeBooking, createBooking } from '../../src/lib/server/bookings';
import { facility } from '../../src/lib/server/db/schema';
import { upcomingSchedule } from '../../src/lib/server/schedule';
import { load } from '../../src/routes/(app)/operations/+page.server';
import { approvedCampaign, approvedCampaignWorld } from './campaign-fixtures';
import { requestEvent } from './request-event';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';
const NOW = DateTime.fromISO('2026-12-01T00:00', { zone: 'utc' }).toMillis();

/** The approved campaign world plus a second tunnel on the US west coast with its own campaign. */
function twoTunnels() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const weekdays = Object.fromEntries(
		['mon', 'tue', 'wed', 'thu', 'fri'].map((d) => [d, ['08:00', '20:00'] as [string, string]])
	);
	const west = db
		.insert(facility)
		.values({
			...DEMO_FACILITIES[0]!,
			name: 'Gannet tunnel',
			timeZone: 'America/Los_Angeles',
			openingHours: weekdays
		})
		.returning({ id: facility.id })
		.get().id;
	const westCampaign = approvedCampaign(
		db,
		w,
		{ ...w.input(), name: 'West coast run', facilityId: west },
		ORIGIN
	);
	const book = (facilityId: string, campaignId: string, zone: string, from: string, to: string) => {
		const booked = createBooking(
			db,
			w.operator,
			facilityId,
			{
				campaignId,
				start: DateTime.fromISO(from, { zone }).toJSDate(),
				end: DateTime.fromISO(to, { zone }).toJSDate(),
				note: ''
			},
			ORIGIN,
			NOW
		);
		if (!booked.ok) throw new Error(booked.message);
		return booked.id;
	};
	return { db, w, west, westCampaign, book };
}

describe('the operator’s schedule', () => {
	it('lists the pencilled and confirmed slots of the next six weeks by facility and local day', () => {
		const { db, w, west, westCampaign, book } = twoTunnels();
		const tern = (from: string, to: string) =>
			book(w.tunnel, w.campaignId, 'Europe/Berlin', from, to);
		const monday = tern('2027-01-04T08:00', '2027-01-04T12:00');
		const confirmed = tern('2027-01-04T13:00', '2027-01-04T15:00');
		changeBooking(db, w.operator, confirmed, { state: 'confirmed' }, 'any', ORIGIN, NOW);
		const cancelled = tern('2027-01-05T09:00', '2027-01-05T10:00');
		changeBooking(db, w.operator, cancelled, { state: 'cancelled' }, 'any', ORIGIN, NOW);
		const done = tern('2027-01-06T09:00', '2027-01-06T10:00');
		changeBooking(db, w.operator, done, { state: 'confirmed' }, 'any', ORIGIN, NOW);
		changeBooking(db, w.operator, done, { state: 'completed' }, 'any', ORIGIN, NOW);
		tern('2026-12-31T09:00', '2026-12-31T10:00'); // before the schedule starts
		const lastWeek = tern('2027-02-12T09:00', '2027-02-12T11:00'); // Friday of the sixth week
		tern('2027-02-15T08:00', '2027-02-15T09:00'); // the Monday after
		// 17:00–19:00 in Los Angeles is 01:00–03:00 UTC the next day: it belongs to the local Monday.
		const evening = book(
			west,
			westCampaign,
			'America/Los_Angeles',
			'2027-01-04T17:00',
			'2027-01-04T19:00'
		);

		const from = DateTime.fromISO('2027-01-04T00:00', { zone: 'Europe/Berlin' }).toJSDate();
		const slot = (id: string, name: string, state: string, start: string, end: string) => ({
			id,
			campaignName: name,
			campaignId: name === 'West coast run' ? westCampaign : w.campaignId,
			state,
			from: start,
			to: end
		});
		const name = w.input().name;
		expect(upcomingSchedule(db, from)).toEqual([
			{
				id: west,
				name: 'Gannet tunnel',
				timeZone: 'America/Los_Angeles',
				booked_s: 2 * 3600,
				days: [
					{
						day: '2027-01-04',
						label: 'Mon 4 Jan',
						slots: [slot(evening, 'West coast run', 'pencilled', '17:00', '19:00')]
					}
				]
			},
			{
				id: w.tunnel,
				name: DEMO_FACILITIES[0]!.name,
				timeZone: 'Europe/Berlin',
				booked_s: 8 * 3600,
				days: [
					{
						day: '2027-01-04',
						label: 'Mon 4 Jan',
						slots: [
							slot(monday, name, 'pencilled', '08:00', '12:00'),
							slot(confirmed, name, 'confirmed', '13:00', '15:00')
						]
					},
					{
						day: '2027-02-12',
						label: 'Fri 12 Feb',
						slots: [slot(lastWeek, name, 'pencilled', '09:00', '11:00')]
					}
				]
			}
		]);
	});

	it('is shown to operators and admins only', () => {
		const { db, w } = twoTunnels();
		const open = (user: typeof w.aeroA) => {
			try {
				return load(requestEvent({ db, user }) as Parameters<typeof load>[0]) as {
					weeks: number;
					schedule: unknown[];
				};
			} catch (thrown) {
				if (isHttpError(thrown)) return thrown.status;
				throw thrown;
			}
		};
		expect(open(w.aeroA)).toBe(403);
		expect(open(w.reviewer)).toBe(403);
		expect(open(w.operator)).toMatchObject({ weeks: 6, schedule: [{}, {}] });
		expect(open(w.admin)).toMatchObject({ weeks: 6 });
	});
});
