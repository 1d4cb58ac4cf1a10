import { error, fail } from '@sveltejs/kit';
import { message, setError, superValidate, type SuperValidated } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { z } from 'zod';
import { openingWindows } from '$lib/booking/calendar';
import { BOOKING_STATES } from '$lib/booking/rules';
import { localSlotToInstants, weekOf } from '$lib/booking/week';
import { availableBookingActions } from '$lib/booking/workflow';
import {
	bookingFormSchema,
	bookingMoveFormSchema,
	bookingSchema,
	closureFormSchema,
	closureSchema,
	type BookingFormInput
} from '$lib/schemas/booking';
import { canBook } from '$lib/server/access';
import {
	bookableCampaigns,
	changeBooking,
	createBooking,
	createClosure,
	findBookingFor,
	listBookings,
	listClosures,
	proposeFor
} from '$lib/server/bookings';
import { getFacility } from '$lib/server/facilities';
import { requirePermission, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL, type Refusal } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';

/** Each campaign's booking form has its own id, so a refusal lands in that campaign's form. */
const bookFormId = (campaignId: string) => `book-${campaignId}`;
const CLOSURE_FORM_ID = 'closure';

export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = requireUser(locals);
	const facility = getFacility(locals.db, params.id);
	if (!facility) error(404, { message: 'No such facility.' });
	const day = url.searchParams.get('day');
	const week = weekOf(day ?? url.searchParams.get('week'), facility.timeZone);
	// The day view is one column of the same week, wider.
	const shown = day ? week.days.filter((d) => d.iso === day) : week.days;
	const booker = canBook(user);
	const now = Date.now();
	const bookable = booker ? bookableCampaigns(locals.db, facility.id) : [];
	const bookForms: Record<string, SuperValidated<BookingFormInput>> = {};
	for (const c of bookable) {
		bookForms[c.id] = await superValidate(
			{ campaignId: c.id, start: '', end: '', note: '' },
			zod4(bookingFormSchema),
			{ id: bookFormId(c.id), errors: false }
		);
	}
	return {
		facility,
		week,
		view: day && shown.length ? ('day' as const) : ('week' as const),
		days: shown.length ? shown : week.days,
		bookings: listBookings(locals.db, user, facility.id, week.from, week.to).map((b) => ({
			...b,
			actions: availableBookingActions(b.state, user)
		})),
		closures: listClosures(locals.db, facility.id, week.from, week.to),
		windows: openingWindows(
			facility.openingHours,
			facility.timeZone,
			week.from.getTime(),
			week.to.getTime()
		),
		canBook: booker,
		bookable: bookable.map((c) => ({
			...c,
			proposal: proposeFor(locals.db, facility.id, c.occupancy_s - c.booked_s, now)
		})),
		bookForms,
		closureForm: booker
			? await superValidate(
					{ kind: 'maintenance' as const, reason: '', start: '', end: '' },
					zod4(closureFormSchema),
					{ id: CLOSURE_FORM_ID, errors: false }
				)
			: null
	};
};

/** The facility, once the user may keep its calendar: checked before any form is read. */
function bookersFacility(locals: App.Locals, facilityId: string) {
	const user = requirePermission(locals, 'book-tunnel-time');
	const facility = getFacility(locals.db, facilityId);
	if (!facility) error(404, { message: 'No such facility.' });
	return { user, facility };
}

/** A refusal at its field where the form has one, else for the form as a whole. */
function refusalField<K extends string>(refusal: Refusal, fields: readonly K[]): K | '' {
	return fields.find((f) => f === refusal.field) ?? '';
}

const changeForm = z.object({ bookingId: z.string().min(1), state: z.enum(BOOKING_STATES) });

export const actions: Actions = {
	book: async ({ locals, params, request, url }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const posted = await request.formData();
		const form = await superValidate(posted, zod4(bookingFormSchema), {
			id: bookFormId(String(posted.get('campaignId') ?? ''))
		});
		if (!form.valid) return fail(400, { form });
		const slot = localSlotToInstants(form.data, facility.timeZone);
		if (!slot) return setError(form, 'start', 'Give a date and time.');
		// The write path's own schema: when the clocks go back, local times in order can name one instant.
		const input = bookingSchema.safeParse({ ...form.data, ...slot });
		if (!input.success) return setError(form, 'end', input.error.issues[0]!.message);
		const created = createBooking(locals.db, user, facility.id, input.data, url.origin);
		if (!created.ok)
			return setError(form, refusalField(created, ['start', 'end'] as const), created.message, {
				status: STATUS_OF_REFUSAL[created.code]
			});
		return message(form, 'Slot booked.');
	},

	move: async ({ locals, params, request, url }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const posted = await request.formData();
		const bookingId = String(posted.get('bookingId') ?? '');
		const found = findBookingFor(locals.db, user, bookingId, facility.id);
		if (!found.ok) error(STATUS_OF_REFUSAL[found.code], { message: found.message });
		const form = await superValidate(posted, zod4(bookingMoveFormSchema), {
			id: `move-${bookingId}`
		});
		if (!form.valid) return fail(400, { form });
		const slot = localSlotToInstants(form.data, facility.timeZone);
		if (!slot) return setError(form, 'start', 'Give a date and time.');
		const moved = changeBooking(locals.db, user, bookingId, slot, url.origin);
		if (!moved.ok)
			return setError(form, refusalField(moved, ['start', 'end'] as const), moved.message, {
				status: STATUS_OF_REFUSAL[moved.code]
			});
		return message(form, 'Slot moved.');
	},

	change: async ({ locals, params, request, url }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const posted = Object.fromEntries(await request.formData());
		const found = findBookingFor(locals.db, user, String(posted.bookingId ?? ''), facility.id);
		if (!found.ok) error(STATUS_OF_REFUSAL[found.code], { message: found.message });
		const parsed = changeForm.safeParse(posted);
		if (!parsed.success) return fail(400, { stepError: 'Choose what the slot becomes.' });
		const changed = changeBooking(
			locals.db,
			user,
			found.booking.id,
			{ state: parsed.data.state },
			url.origin
		);
		if (!changed.ok) return fail(STATUS_OF_REFUSAL[changed.code], { stepError: changed.message });
		return { changed: parsed.data.state };
	},

	close: async ({ locals, params, request }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const form = await superValidate(request, zod4(closureFormSchema), { id: CLOSURE_FORM_ID });
		if (!form.valid) return fail(400, { form });
		const slot = localSlotToInstants(form.data, facility.timeZone);
		if (!slot) return setError(form, 'start', 'Give a date and time.');
		// The write path's own schema: when the clocks go back, local times in order can name one instant.
		const input = closureSchema.safeParse({ ...form.data, ...slot });
		if (!input.success) return setError(form, 'end', input.error.issues[0]!.message);
		const created = createClosure(locals.db, user, facility.id, input.data);
		if (!created.ok)
			return setError(form, refusalField(created, ['start', 'end'] as const), created.message, {
				status: STATUS_OF_REFUSAL[created.code]
			});
		return message(form, 'Closure entered.');
	}
};
