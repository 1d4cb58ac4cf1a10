import { DateTime } from 'luxon';
import type { Interval } from './rules';

export type OpeningHours = Partial<
	Record<'mon' | 'tue' | 'wed' | 'thu' | 'fri' | 'sat' | 'sun', [string, string]>
>;
const DAY_KEYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;

function atLocal(day: DateTime, clock: string): DateTime {
	const [hour, minute] = clock.split(':').map(Number) as [number, number];
	// Wall-clock times in the facility's zone; luxon resolves each to the right UTC offset, so a
	// day across a daylight-saving change keeps its local opening hours.
	return day.set({ hour, minute, second: 0, millisecond: 0 });
}

/** The facility's opening windows, as UTC instants, on every local day that meets [from, to). */
export function openingWindows(
	hours: OpeningHours,
	timeZone: string,
	from_ms: number,
	to_ms: number
): Interval[] {
	const windows: Interval[] = [];
	let day = DateTime.fromMillis(from_ms, { zone: timeZone }).startOf('day');
	const last = DateTime.fromMillis(to_ms, { zone: timeZone }).endOf('day');
	while (day <= last) {
		const span = hours[DAY_KEYS[day.weekday - 1]!];
		if (span) {
			const start = atLocal(day, span[0]).toMillis();
			const end = atLocal(day, span[1]).toMillis();
			if (end > from_ms && start < to_ms) windows.push({ start, end });
		}
		day = day.plus({ days: 1 });
	}
	return windows;
}

/** Whether the whole slot lies inside one opening window: slots do not run past closing time. */
export function withinOpeningHours(slot: Interval, hours: OpeningHours, timeZone: string): boolean {
	return openingWindows(hours, timeZone, slot.start, slot.end).some(
		(w) => w.start <= slot.start && slot.end <= w.end
	);
}

/** Free parts of the windows once the busy intervals (bookings, closures) are taken out. */
export function freeTime(windows: Interval[], busy: Interval[]): Interval[] {
	const taken = [...busy].sort((a, b) => a.start - b.start);
	const free: Interval[] = [];
	for (const w of windows) {
		let cursor = w.start;
		for (const b of taken) {
			if (b.end <= cursor || b.start >= w.end) continue;
			if (b.start > cursor) free.push({ start: cursor, end: b.start });
			cursor = Math.max(cursor, b.end);
		}
		if (cursor < w.end) free.push({ start: cursor, end: w.end });
	}
	return free;
}

/**
 * Slots that cover `duration_s` of tunnel time in the first free opening time from `from_ms`,
 * split across days where one day's hours do not hold it all. Searches up to `horizon_days`.
 */
export function proposeSlots(
	duration_s: number,
	x: {
		hours: OpeningHours;
		timeZone: string;
		busy: Interval[];
		from_ms: number;
		horizon_days?: number;
		minimumSlot_s?: number;
	}
): Interval[] {
	const horizon_ms = (x.horizon_days ?? 120) * 86_400_000;
	const minimum_ms = (x.minimumSlot_s ?? 1800) * 1000;
	const windows = openingWindows(x.hours, x.timeZone, x.from_ms, x.from_ms + horizon_ms).map(
		(w) => ({ start: Math.max(w.start, x.from_ms), end: w.end })
	);
	let remaining_ms = Math.ceil(duration_s) * 1000;
	const slots: Interval[] = [];
	for (const gap of freeTime(windows, x.busy)) {
		if (remaining_ms <= 0) break;
		const length = gap.end - gap.start;
		// Scraps shorter than the minimum are not worth a set-up; the last piece may be short.
		if (length < Math.min(minimum_ms, remaining_ms)) continue;
		const take = Math.min(length, remaining_ms);
		slots.push({ start: gap.start, end: gap.start + take });
		remaining_ms -= take;
	}
	return remaining_ms > 0 ? [] : slots;
}
