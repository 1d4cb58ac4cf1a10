import { DateTime } from 'luxon';

/** How a calendar day is named on every page: "Mon 4 Jan". */
const DAY_LABEL = 'ccc d LLL';

/** The local Monday 00:00 of the week holding `day` (yyyy-mm-dd, or now), and the week's days. */
export function weekOf(day: string | null, timeZone: string) {
	const parsed = day ? DateTime.fromISO(day, { zone: timeZone }) : DateTime.now().setZone(timeZone);
	const monday = (parsed.isValid ? parsed : DateTime.now().setZone(timeZone)).startOf('week');
	const days = Array.from({ length: 7 }, (_, i) => monday.plus({ days: i }));
	return {
		from: monday.toJSDate(),
		to: monday.plus({ weeks: 1 }).toJSDate(),
		days: days.map((d) => ({ iso: d.toISODate()!, label: d.toFormat(DAY_LABEL) })),
		previous: monday.minus({ weeks: 1 }).toISODate()!,
		next: monday.plus({ weeks: 1 }).toISODate()!
	};
}

/** A facility-local wall-clock time ("2027-01-04T08:00") as a UTC instant. */
export function localToInstant(local: string, timeZone: string): Date | null {
	const t = DateTime.fromISO(local, { zone: timeZone });
	return t.isValid ? t.toJSDate() : null;
}

/** A UTC instant as the facility's wall-clock parts, for placing and labelling blocks. */
export function localParts(instant: Date | number, timeZone: string) {
	const t = DateTime.fromMillis(+instant, { zone: timeZone });
	return {
		day: t.toISODate()!,
		dayLabel: t.toFormat(DAY_LABEL),
		minutes: t.hour * 60 + t.minute,
		label: t.toFormat('HH:mm'),
		input: t.toFormat("yyyy-LL-dd'T'HH:mm")
	};
}

/** A form's local start and end as instants; null where either is not a time in the zone. */
export function localSlotToInstants(
	slot: { start: string; end: string },
	timeZone: string
): { start: Date; end: Date } | null {
	const start = localToInstant(slot.start, timeZone);
	const end = localToInstant(slot.end, timeZone);
	return start && end ? { start, end } : null;
}
