import type { Interval } from './rules';
import { localParts } from './week';

/** Hours shown when the week has no opening at all: a working day. */
const EMPTY_WEEK_HOURS = { first: 7, last: 19 };

export type GridSpan = { first: number; last: number; hours: number[] };

/**
 * The hour rows of a calendar grid: from the earliest opening to the latest closing of the
 * given windows, in whole local hours of the facility's zone.
 */
export function gridSpan(windows: readonly Interval[], timeZone: string): GridSpan {
	const minutes = windows.flatMap((w) => [
		localParts(w.start, timeZone).minutes,
		localParts(w.end, timeZone).minutes
	]);
	const first = minutes.length ? Math.floor(Math.min(...minutes) / 60) : EMPTY_WEEK_HOURS.first;
	const last = minutes.length ? Math.ceil(Math.max(...minutes) / 60) : EMPTY_WEEK_HOURS.last;
	return { first, last, hours: Array.from({ length: last - first }, (_, i) => first + i) };
}

/**
 * Where an interval sits in one local day's column, in hours from the grid's first row: a part
 * before or after the day is cut at the grid's edge. Null where it does not meet the day.
 */
export function placeInDay(
	start: Date | number,
	end: Date | number,
	day: string,
	span: GridSpan,
	timeZone: string
): { top_h: number; length_h: number } | null {
	const a = localParts(start, timeZone);
	const b = localParts(end, timeZone);
	const from = a.day < day ? span.first * 60 : a.minutes;
	const to = b.day > day ? span.last * 60 : b.minutes;
	if (a.day > day || b.day < day || to <= from) return null;
	return { top_h: (from - span.first * 60) / 60, length_h: (to - from) / 60 };
}
