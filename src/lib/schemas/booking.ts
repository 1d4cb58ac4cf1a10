import { z } from 'zod';
import { BOOKING_STATES, CLOSURE_KINDS } from '../booking/rules';

const instant = z.coerce.date({ error: 'Give a date and time.' });
/**
 * A wall-clock time in the facility's zone, as a date-and-time field sends it; the forms turn it
 * into an instant with the facility's zone after validation.
 */
const localTime = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?$/, { error: 'Give a date and time.' });
const localSlot = { start: localTime, end: localTime };

// Local times compare as text: both sides share the field's fixed-width format.
function endsAfterStart(what: string) {
	const check = (s: { start?: Date | string; end?: Date | string }) =>
		!s.start || !s.end || s.end > s.start;
	return [check, { path: ['end'], error: `The ${what} must end after it starts.` }] as [
		typeof check,
		{ path: string[]; error: string }
	];
}

const bookingFields = z.object({
	campaignId: z.string().min(1, { error: 'Choose an approved campaign.' }),
	start: instant,
	end: instant,
	note: z.string().trim().max(500).default('')
});

/** One schema for the JSON API and the database write; the form takes its fields in local time. */
export const bookingSchema = bookingFields.refine(...endsAfterStart('slot'));
export const bookingFormSchema = bookingFields.extend(localSlot).refine(...endsAfterStart('slot'));

export const bookingChangeSchema = z
	.object({
		start: instant.optional(),
		end: instant.optional(),
		state: z.enum(BOOKING_STATES).optional(),
		note: z.string().trim().max(500).optional()
	})
	.refine(...endsAfterStart('slot'));
/** Moving a slot on the calendar page: the slot and its new local times. */
export const bookingMoveFormSchema = z
	.object({ bookingId: z.string().min(1), ...localSlot })
	.refine(...endsAfterStart('slot'));

const closureFields = z.object({
	kind: z.enum(CLOSURE_KINDS),
	reason: z.string().trim().min(1, { error: 'Say why the tunnel is closed.' }).max(200),
	start: instant,
	end: instant
});
export const closureSchema = closureFields.refine(...endsAfterStart('closure'));
export const closureFormSchema = closureFields
	.extend(localSlot)
	.refine(...endsAfterStart('closure'));

export type BookingInput = z.infer<typeof bookingSchema>;
export type BookingFormInput = z.infer<typeof bookingFormSchema>;
export type BookingChange = z.infer<typeof bookingChangeSchema>;
export type BookingMoveFormInput = z.infer<typeof bookingMoveFormSchema>;
export type ClosureInput = z.infer<typeof closureSchema>;
export type ClosureFormInput = z.infer<typeof closureFormSchema>;
