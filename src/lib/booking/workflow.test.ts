import { describe, expect, it } from 'vitest';
import { ROLES } from '../roles';
import { BOOKING_STATES, type BookingState } from './rules';
import {
	availableBookingActions,
	BOOKING_ACTIONS,
	bookingTransition,
	type BookingAction
} from './workflow';

/**
 * The slot workflow as the operators described it (booking), listed by hand rather than derived
 * from BOOKING_TRANSITIONS: [state, action, next state]. Every other pair is refused.
 */
const ALLOWED: [BookingState, BookingAction, BookingState][] = [
	['pencilled', 'confirm', 'confirmed'],
	['pencilled', 'cancel', 'cancelled'],
	['pencilled', 'move', 'pencilled'],
	['confirmed', 'pencil', 'pencilled'],
	['confirmed', 'complete', 'completed'],
	['confirmed', 'cancel', 'cancelled'],
	['confirmed', 'move', 'confirmed']
];
const BOOKERS = new Set(['operator', 'admin']);

describe('booking workflow, every state × action × role', () => {
	const cases = BOOKING_STATES.flatMap((state) =>
		BOOKING_ACTIONS.flatMap((action) => ROLES.map((role) => [state, action, role] as const))
	);

	it.each(cases)('%s + %s by %s', (state, action, role) => {
		const result = bookingTransition(state, action, { roles: [role] });
		const allowed = ALLOWED.find(([s, a]) => s === state && a === action);
		if (!BOOKERS.has(role)) {
			expect(result).toMatchObject({ ok: false, code: 'forbidden' });
		} else if (allowed) {
			expect(result).toEqual({ ok: true, to: allowed[2] });
		} else {
			expect(result).toMatchObject({ ok: false, code: 'conflict' });
		}
	});

	it('names the field and the reason of a refused move or state change', () => {
		expect(bookingTransition('completed', 'move', { roles: ['operator'] })).toEqual({
			ok: false,
			code: 'conflict',
			message: 'A completed booking cannot be moved.',
			field: 'start'
		});
		expect(bookingTransition('cancelled', 'confirm', { roles: ['admin'] })).toEqual({
			ok: false,
			code: 'conflict',
			message: 'A cancelled booking cannot become confirmed.',
			field: 'state'
		});
	});

	it('offers each actor exactly the actions the table allows', () => {
		expect(availableBookingActions('pencilled', { roles: ['operator'] })).toEqual([
			'confirm',
			'cancel',
			'move'
		]);
		expect(availableBookingActions('confirmed', { roles: ['admin'] })).toEqual([
			'pencil',
			'complete',
			'cancel',
			'move'
		]);
		expect(availableBookingActions('completed', { roles: ['operator', 'admin'] })).toEqual([]);
		expect(availableBookingActions('pencilled', { roles: ['reviewer', 'aerodynamicist'] })).toEqual(
			[]
		);
	});
});
