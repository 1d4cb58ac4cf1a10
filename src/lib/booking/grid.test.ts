import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { gridSpan, placeInDay } from './grid';

const ZONE = 'Europe/Berlin';
const local = (iso: string) => DateTime.fromISO(iso, { zone: ZONE }).toMillis();
const utc = (iso: string) => DateTime.fromISO(iso, { zone: 'utc' }).toMillis();

describe('calendar grid rows', () => {
	it('run from the earliest opening to the latest closing, in whole local hours', () => {
		const windows = [
			{ start: local('2027-01-04T08:30'), end: local('2027-01-04T17:15') },
			{ start: local('2027-01-05T09:00'), end: local('2027-01-05T16:00') }
		];
		const span = gridSpan(windows, ZONE);
		expect([span.first, span.last]).toEqual([8, 18]);
		expect(span.hours).toEqual([8, 9, 10, 11, 12, 13, 14, 15, 16, 17]);
	});

	it('show a working day when the week has no opening (product default)', () => {
		expect(gridSpan([], ZONE)).toMatchObject({ first: 7, last: 19 });
	});

	// IANA tz database, Europe/Berlin: UTC+1 in winter; summer time (UTC+2) starts on the last
	// Sunday of March, 2027-03-28, at 01:00 UTC (Directive 2000/84/EC).
	it('reads opening hours on the wall clock across the change to summer time', () => {
		const winter = { start: utc('2027-03-26T07:00'), end: utc('2027-03-26T17:00') };
		const summer = { start: utc('2027-03-29T06:00'), end: utc('2027-03-29T16:00') };
		expect(gridSpan([winter, summer], ZONE)).toMatchObject({ first: 8, last: 18 });
	});
});

describe('placing a block in a day column', () => {
	const span = gridSpan(
		[{ start: local('2027-01-04T08:00'), end: local('2027-01-04T18:00') }],
		ZONE
	);

	it('puts a slot at its local hours, counted from the first row', () => {
		expect(
			placeInDay(local('2027-01-04T09:00'), local('2027-01-04T11:30'), '2027-01-04', span, ZONE)
		).toEqual({ top_h: 1, length_h: 2.5 });
		expect(
			placeInDay(local('2027-01-04T09:00'), local('2027-01-04T11:30'), '2027-01-05', span, ZONE)
		).toBeNull();
	});

	it('cuts a closure over midnight at the grid edge of each day it meets', () => {
		const start = local('2027-01-04T16:00');
		const end = local('2027-01-05T10:00');
		expect(placeInDay(start, end, '2027-01-04', span, ZONE)).toEqual({ top_h: 8, length_h: 2 });
		expect(placeInDay(start, end, '2027-01-05', span, ZONE)).toEqual({ top_h: 0, length_h: 2 });
		expect(placeInDay(start, end, '2027-01-06', span, ZONE)).toBeNull();
	});

	it('places by the wall clock on the first day of summer time', () => {
		// 06:00 UTC on 2027-03-29 is 08:00 in Berlin (UTC+2), the grid's first row.
		expect(
			placeInDay(utc('2027-03-29T06:00'), utc('2027-03-29T07:00'), '2027-03-29', span, ZONE)
		).toEqual({ top_h: 0, length_h: 1 });
	});
});
