/** Booking states: pencilled in, confirmed with the client, completed, or cancelled. */
export const BOOKING_STATES = ['pencilled', 'confirmed', 'completed', 'cancelled'] as const;
export type BookingState = (typeof BOOKING_STATES)[number];

export const CLOSURE_KINDS = ['maintenance', 'calibration', 'holiday', 'other'] as const;

/** States that hold the tunnel: only these take part in the overlap rule. */
export const ACTIVE_BOOKING_STATES: readonly BookingState[] = ['pencilled', 'confirmed'];

export type Interval = { start: number; end: number };

/** Half-open intervals [start, end): slots that only touch do not overlap. */
export function overlaps(a: Interval, b: Interval): boolean {
	return a.start < b.end && b.start < a.end;
}
