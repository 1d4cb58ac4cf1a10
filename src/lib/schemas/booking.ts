import { z } from 'zod';
import { BOOKING_STATES, CLOSURE_KINDS } from '../booking/rules';

const instant = z.coerce.date({ error: 'Give a date and time.' });

/** One schema for the booking form, the JSON API and the database write. */
export const bookingSchema = z
	.object({
		campaignId: z.string().min(1, { error: 'Choose an approved campaign.' }),
		start: instant,
		end: instant,
		note: z.string().trim().max(500).default('')
	})
	.refine((b) => b.end > b.start, { path: ['end'], error: 'The slot must end after it starts.' });

export const bookingChangeSchema = z
	.object({
		start: instant.optional(),
		end: instant.optional(),
		state: z.enum(BOOKING_STATES).optional(),
		note: z.string().trim().max(500).optional()
	})
	.refine((b) => !b.start || !b.end || b.end > b.start, {
		path: ['end'],
		error: 'The slot must end after it starts.'
	});

export const closureSchema = z
	.object({
		kind: z.enum(CLOSURE_KINDS),
		reason: z.string().trim().min(1, { error: 'Say why the tunnel is closed.' }).max(200),
		start: instant,
		end: instant
	})
	.refine((c) => c.end > c.start, {
		path: ['end'],
		error: 'The closure must end after it starts.'
	});

export type BookingInput = z.infer<typeof bookingSchema>;
export type BookingChange = z.infer<typeof bookingChangeSchema>;
export type ClosureInput = z.infer<typeof closureSchema>;
