import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { freeTime, openingWindows, proposeSlots, withinOpeningHours } from './calendar';
import { overlaps } from './rules';

const WEEKDAYS = {
	mon: ['08:00', '18:00'],
	tue: ['08:00', '18:00'],
	wed: ['08:00', '18:00'],
	thu: ['08:00', '18:00'],
	fri: ['08:00', '18:00']
} as const;
const hours = WEEKDAYS as unknown as Parameters<typeof openingWindows>[0];
const utc = (iso: string) => DateTime.fromISO(iso, { zone: 'utc' }).toMillis();
// Product rule values for these tests: no proposed slot under an hour, quarter-hour clock grid.
const CUTS = { minimumSlot_s: 3600, slotStep_s: 900 };
const HOUR_MS = 3600_000;

describe('overlap rule', () => {
	it('lets slots touch but not overlap by a second', () => {
		const a = { start: utc('2027-01-04T08:00'), end: utc('2027-01-04T12:00') };
		expect(overlaps(a, { start: a.end, end: a.end + 3600_000 })).toBe(false);
		expect(overlaps(a, { start: a.end - 1000, end: a.end + 3600_000 })).toBe(true);
		expect(overlaps(a, { start: a.start - 3600_000, end: a.start })).toBe(false);
		expect(overlaps(a, { start: a.start + 1000, end: a.end - 1000 })).toBe(true);
	});
});

describe('opening hours across daylight-saving changes (IANA tz database, Europe/Berlin)', () => {
	// EU summer time starts on the last Sunday of March (2027-03-28) and ends on the last Sunday
	// of October (2027-10-31), at 01:00 UTC (Directive 2000/84/EC).
	it('keeps 08:00 local as 07:00 UTC in winter and 06:00 UTC in summer', () => {
		const windows = openingWindows(
			hours,
			'Europe/Berlin',
			utc('2027-03-25T00:00'),
			utc('2027-03-30T00:00')
		);
		expect(
			windows.map((w) =>
				DateTime.fromMillis(w.start, { zone: 'utc' }).toISO({ suppressMilliseconds: true })
			)
		).toEqual(['2027-03-25T07:00:00Z', '2027-03-26T07:00:00Z', '2027-03-29T06:00:00Z']);
		expect(windows.every((w) => w.end - w.start === 10 * 3600_000)).toBe(true);
	});

	it('handles the autumn change in the same way', () => {
		const [friday, monday] = openingWindows(
			hours,
			'Europe/Berlin',
			utc('2027-10-29T00:00'),
			utc('2027-11-02T00:00')
		);
		expect(DateTime.fromMillis(friday!.start, { zone: 'utc' }).hour).toBe(6);
		expect(DateTime.fromMillis(monday!.start, { zone: 'utc' }).hour).toBe(7);
	});

	it('refuses a slot that runs past closing time', () => {
		const monday = utc('2027-03-29T06:00');
		expect(
			withinOpeningHours({ start: monday, end: monday + 10 * 3600_000 }, hours, 'Europe/Berlin')
		).toBe(true);
		expect(
			withinOpeningHours(
				{ start: monday, end: monday + 10 * 3600_000 + 1000 },
				hours,
				'Europe/Berlin'
			)
		).toBe(false);
		expect(
			withinOpeningHours(
				{ start: utc('2027-03-27T09:00'), end: utc('2027-03-27T10:00') },
				hours,
				'Europe/Berlin'
			)
		).toBe(false);
	});
});

describe('proposing slots', () => {
	it('fills the first free opening time, around bookings and closures, across days', () => {
		const from = utc('2027-01-04T07:00'); // Monday 08:00 in Berlin (UTC+1)
		const busy = [{ start: utc('2027-01-04T09:00'), end: utc('2027-01-04T13:00') }];
		const proposal = proposeSlots(14 * 3600, {
			hours,
			timeZone: 'Europe/Berlin',
			busy,
			from_ms: from,
			...CUTS
		});
		expect(proposal).toEqual({
			ok: true,
			slots: [
				{ start: utc('2027-01-04T07:00'), end: utc('2027-01-04T09:00') },
				{ start: utc('2027-01-04T13:00'), end: utc('2027-01-04T17:00') },
				{ start: utc('2027-01-05T07:00'), end: utc('2027-01-05T15:00') }
			]
		});
	});

	it('finds nothing when the horizon cannot hold the campaign, and says so', () => {
		expect(
			proposeSlots(1000 * 3600, {
				hours,
				timeZone: 'Europe/Berlin',
				busy: [],
				from_ms: utc('2027-01-04T07:00'),
				horizon_days: 7,
				...CUTS
			})
		).toEqual({
			ok: false,
			message:
				'The 1000 h 00 min still to book does not fit the free opening hours of the next 7 days in slots of at least 1 h 00 min.'
		});
	});

	it('never leaves a remainder shorter than the minimum: the slot before stops short instead', () => {
		// 10 h 15 min on 10-hour days: filling Monday would leave a 15-minute sliver for Tuesday.
		const proposal = proposeSlots(10 * 3600 + 15 * 60, {
			hours,
			timeZone: 'Europe/Berlin',
			busy: [],
			from_ms: utc('2027-01-04T07:00'),
			...CUTS
		});
		expect(proposal).toEqual({
			ok: true,
			slots: [
				{ start: utc('2027-01-04T07:00'), end: utc('2027-01-04T16:15') },
				{ start: utc('2027-01-05T07:00'), end: utc('2027-01-05T08:00') }
			]
		});
	});

	it('waits for a gap that holds the whole rest when the gap before cannot keep the minimum', () => {
		// Monday has one free hour; 1 h 30 min cannot be split into two slots of an hour or more.
		const proposal = proposeSlots(90 * 60, {
			hours,
			timeZone: 'Europe/Berlin',
			busy: [{ start: utc('2027-01-04T08:00'), end: utc('2027-01-04T17:00') }],
			from_ms: utc('2027-01-04T07:00'),
			...CUTS
		});
		expect(proposal).toEqual({
			ok: true,
			slots: [{ start: utc('2027-01-05T07:00'), end: utc('2027-01-05T08:30') }]
		});
	});

	it('refuses a need shorter than the minimum, which no slot of its own can hold', () => {
		const proposal = proposeSlots(20 * 60, {
			hours,
			timeZone: 'Europe/Berlin',
			busy: [],
			from_ms: utc('2027-01-04T07:00'),
			...CUTS
		});
		expect(proposal).toMatchObject({ ok: false, message: expect.stringMatching(/does not fit/) });
	});

	it('rounds the time up to whole steps and starts and ends slots on the local quarter hours', () => {
		// A booking ends at 09:07 local; 2 h 05 min is wanted. From a "now" of 08:03 local.
		const proposal = proposeSlots(2 * 3600 + 5 * 60, {
			hours,
			timeZone: 'Europe/Berlin',
			busy: [{ start: utc('2027-01-04T07:03'), end: utc('2027-01-04T08:07') }],
			from_ms: utc('2027-01-04T07:03'),
			...CUTS
		});
		expect(proposal).toEqual({
			ok: true,
			slots: [{ start: utc('2027-01-04T08:15'), end: utc('2027-01-04T10:30') }]
		});
		// The grid is the facility's wall clock: on whole hours in Kolkata (UTC+05:30, IANA tz
		// database) a slot starts at half past the hour in UTC.
		const kolkata = proposeSlots(3600, {
			hours,
			timeZone: 'Asia/Kolkata',
			busy: [],
			from_ms: utc('2027-01-04T03:31'), // 09:01 local
			minimumSlot_s: 3600,
			slotStep_s: 3600
		});
		expect(kolkata).toEqual({
			ok: true,
			slots: [{ start: utc('2027-01-04T04:30'), end: utc('2027-01-04T05:30') }]
		});
	});

	it('keeps every proposed slot inside opening hours and free time, at least the minimum long', () => {
		const busy = [
			{ start: utc('2027-01-04T09:10'), end: utc('2027-01-04T09:50') },
			{ start: utc('2027-01-05T12:05'), end: utc('2027-01-05T16:40') },
			{ start: utc('2027-01-06T07:00'), end: utc('2027-01-06T07:40') }
		];
		const proposal = proposeSlots(23 * 3600 + 7 * 60, {
			hours,
			timeZone: 'Europe/Berlin',
			busy,
			from_ms: utc('2027-01-04T06:52'),
			...CUTS
		});
		if (!proposal.ok) throw new Error(proposal.message);
		for (const slot of proposal.slots) {
			expect(withinOpeningHours(slot, hours, 'Europe/Berlin')).toBe(true);
			expect(busy.some((b) => overlaps(slot, b))).toBe(false);
			expect(slot.end - slot.start).toBeGreaterThanOrEqual(HOUR_MS);
			expect(slot.start % (15 * 60_000)).toBe(0);
			expect(slot.end % (15 * 60_000)).toBe(0);
		}
		// 23 h 07 min rounded up to the next quarter hour.
		expect(proposal.slots.reduce((s, x) => s + x.end - x.start, 0)).toBe(
			23 * HOUR_MS + 15 * 60_000
		);
	});

	it('takes busy time out of the windows', () => {
		expect(
			freeTime(
				[{ start: 0, end: 100 }],
				[
					{ start: 20, end: 30 },
					{ start: 25, end: 40 },
					{ start: 90, end: 200 }
				]
			)
		).toEqual([
			{ start: 0, end: 20 },
			{ start: 40, end: 90 }
		]);
	});
});
