import { DateTime } from 'luxon';
import { formatDuration } from '../campaign/display';
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

const DAY_MS = 86_400_000;

/**
 * The instant moved onto the `step_ms` grid of the facility's wall clock, counted from local
 * midnight, so proposals start and end at round local times (08:00, 08:15…) on any day,
 * daylight-saving changes included. `round` is Math.ceil for starts and Math.floor for ends.
 */
function onClockGrid(
	instant: number,
	step_ms: number,
	timeZone: string,
	round: (x: number) => number
): number {
	const local = DateTime.fromMillis(instant, { zone: timeZone });
	const clock_ms =
		((local.hour * 60 + local.minute) * 60 + local.second) * 1000 + local.millisecond;
	const grid_ms = round(clock_ms / step_ms) * step_ms;
	if (grid_ms === clock_ms) return instant;
	const within_ms = grid_ms % DAY_MS;
	return local
		.startOf('day')
		.plus({ days: Math.floor(grid_ms / DAY_MS) })
		.set({
			hour: Math.floor(within_ms / 3_600_000),
			minute: Math.floor(within_ms / 60_000) % 60,
			second: Math.floor(within_ms / 1000) % 60,
			millisecond: 0
		})
		.toMillis();
}

export type SlotProposal = { ok: true; slots: Interval[] } | { ok: false; message: string };

/**
 * Slots that cover `duration_s` of tunnel time in the first free opening time from `from_ms`,
 * split across days where one day's hours do not hold it all; searches up to `horizon_days`.
 * Every slot starts and ends on the facility's `slotStep_s` clock grid (the time needed is rounded
 * up to whole steps) and none is shorter than `minimumSlot_s`, since a sliver of a slot does not
 * pay for a set-up check. Where that cannot be met the proposal is refused with the reason.
 */
export function proposeSlots(
	duration_s: number,
	x: {
		hours: OpeningHours;
		timeZone: string;
		busy: Interval[];
		from_ms: number;
		horizon_days?: number;
		minimumSlot_s: number;
		slotStep_s: number;
	}
): SlotProposal {
	const horizon_days = x.horizon_days ?? 120;
	const step_ms = Math.round(x.slotStep_s * 1000);
	const wholeSteps = (ms: number) => Math.ceil(ms / step_ms) * step_ms;
	const need_ms = wholeSteps(duration_s * 1000);
	const least_ms = Math.max(step_ms, wholeSteps(x.minimumSlot_s * 1000));
	const shortest = formatDuration(least_ms / 1000);
	if (need_ms < least_ms)
		return {
			ok: false,
			message: `The ${formatDuration(duration_s)} still to book does not fit a slot of its own: the shortest slot is ${shortest}. Lengthen a booked slot instead.`
		};
	const windows = openingWindows(
		x.hours,
		x.timeZone,
		x.from_ms,
		x.from_ms + horizon_days * DAY_MS
	).map((w) => ({ start: Math.max(w.start, x.from_ms), end: w.end }));
	const gaps = freeTime(windows, x.busy)
		.map((g) => ({
			start: onClockGrid(g.start, step_ms, x.timeZone, Math.ceil),
			end: onClockGrid(g.end, step_ms, x.timeZone, Math.floor)
		}))
		.filter((g) => g.end - g.start >= least_ms);
	let remaining_ms = need_ms;
	const slots: Interval[] = [];
	for (const gap of gaps) {
		if (remaining_ms === 0) break;
		const free_ms = gap.end - gap.start;
		let take: number;
		if (free_ms >= remaining_ms) take = remaining_ms;
		else if (remaining_ms - free_ms >= least_ms) take = free_ms;
		// Filling this gap would leave a sliver to book later: stop short so that exactly the
		// minimum is left, or, where this gap cannot keep the minimum too, wait for a gap that
		// holds all that is left.
		else if (remaining_ms - least_ms >= least_ms) take = remaining_ms - least_ms;
		else continue;
		slots.push({ start: gap.start, end: gap.start + take });
		remaining_ms -= take;
	}
	if (remaining_ms > 0)
		return {
			ok: false,
			message: `The ${formatDuration(duration_s)} still to book does not fit the free opening hours of the next ${horizon_days} days in slots of at least ${shortest}.`
		};
	return { ok: true, slots };
}
