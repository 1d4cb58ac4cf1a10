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
		const slots = proposeSlots(14 * 3600, {
			hours,
			timeZone: 'Europe/Berlin',
			busy,
			from_ms: from
		});
		expect(slots).toEqual([
			{ start: utc('2027-01-04T07:00'), end: utc('2027-01-04T09:00') },
			{ start: utc('2027-01-04T13:00'), end: utc('2027-01-04T17:00') },
			{ start: utc('2027-01-05T07:00'), end: utc('2027-01-05T15:00') }
		]);
		expect(slots.reduce((s, x) => s + x.end - x.start, 0)).toBe(14 * 3600_000);
	});

	it('finds nothing when the horizon cannot hold the campaign', () => {
		expect(
			proposeSlots(1000 * 3600, {
				hours,
				timeZone: 'Europe/Berlin',
				busy: [],
				from_ms: utc('2027-01-04T07:00'),
				horizon_days: 7
			})
		).toEqual([]);
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
