import { refuse, type Refusal } from '../refusal';
import type { Role } from '../roles';
import type { BookingState } from './rules';

/**
 * The life of a booked slot, in one table. An operator pencils a slot in, confirms it with the
 * client, marks it done once run, or cancels it; a confirmed slot can go back to pencilled, and
 * only slots that still hold the tunnel can move.
 */
export const BOOKING_ACTIONS = ['confirm', 'pencil', 'complete', 'cancel', 'move'] as const;
export type BookingAction = (typeof BOOKING_ACTIONS)[number];

/** The facility's own people who keep its calendar. */
export const BOOKING_ROLES: readonly Role[] = ['operator', 'admin'];

type Rule = {
	from: readonly BookingState[];
	/** The state after the action; absent where the slot keeps its state. */
	to?: BookingState;
};

export const BOOKING_TRANSITIONS: Record<BookingAction, Rule> = {
	confirm: { from: ['pencilled'], to: 'confirmed' },
	pencil: { from: ['confirmed'], to: 'pencilled' },
	complete: { from: ['confirmed'], to: 'completed' },
	cancel: { from: ['pencilled', 'confirmed'], to: 'cancelled' },
	move: { from: ['pencilled', 'confirmed'] }
};

export const BOOKING_ACTION_LABELS: Record<BookingAction, string> = {
	confirm: 'Confirm',
	pencil: 'Back to pencilled',
	complete: 'Mark done',
	cancel: 'Cancel slot',
	move: 'Move slot'
};

/** The action that takes a slot to `state`, for clients that name the state they want. */
export const ACTION_FOR_STATE: Record<BookingState, BookingAction> = {
	pencilled: 'pencil',
	confirmed: 'confirm',
	completed: 'complete',
	cancelled: 'cancel'
};

export type BookingStep = { ok: true; to: BookingState } | Refusal;

/** Whether `actor` may take `action` on a slot in `state`: who first, then the state. */
export function bookingTransition(
	state: BookingState,
	action: BookingAction,
	actor: { roles: readonly Role[] }
): BookingStep {
	if (!BOOKING_ROLES.some((r) => actor.roles.includes(r)))
		return refuse('forbidden', 'Only operators and admins change bookings.');
	const rule = BOOKING_TRANSITIONS[action];
	if (!rule.from.includes(state)) {
		return action === 'move'
			? refuse('conflict', `A ${state} booking cannot be moved.`, 'start')
			: refuse('conflict', `A ${state} booking cannot become ${rule.to}.`, 'state');
	}
	return { ok: true, to: rule.to ?? state };
}

/** The actions open to `actor` on a slot in `state`, for the buttons a page shows. */
export function availableBookingActions(
	state: BookingState,
	actor: { roles: readonly Role[] }
): BookingAction[] {
	return BOOKING_ACTIONS.filter((a) => bookingTransition(state, a, actor).ok);
}
