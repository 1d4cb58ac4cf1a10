import { error } from '@sveltejs/kit';
import { message, setError, superValidate, type SuperValidated, fail } from 'sveltekit-superforms';
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
import { refuse, STATUS_OF_REFUSAL, type Outcome } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';
import { postedBaseVersion, withBaseVersion } from '$lib/server/form-versions';
import { postedForm, validatePosted } from '$lib/server/forms';
import type { StaleRefusal } from '$lib/server/versions';
import { staleSentence } from '$lib/versions';

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

type LocalSlotForm = SuperValidated<{ start: string; end: string }>;

/**
 * Answers a valid slot form: its local times become instants in the facility's zone, `save`
 * takes them, and a refusal lands at its field (else on the form), success as `done`.
 */
function saveSlotForm(
	form: LocalSlotForm,
	timeZone: string,
	save: (slot: { start: Date; end: Date }) => Outcome<unknown> | StaleRefusal,
	done: string
) {
	const slot = localSlotToInstants(form.data, timeZone);
	if (!slot) return setError(form, 'start', 'Give a date and time.');
	const saved = save(slot);
	if (!saved.ok) {
		// A form carries no If-Match, so a stale slot is a conflict (409), told in words.
		if ('stale' in saved) return setError(form, '', staleSentence(saved.stale), { status: 409 });
		const field = saved.field === 'start' || saved.field === 'end' ? saved.field : '';
		return setError(form, field, saved.message, { status: STATUS_OF_REFUSAL[saved.code] });
	}
	return message(form, done);
}

/**
 * The write path's own schema over the instants: when the clocks go back, local times in order
 * can name one instant, which the entity's rule refuses at the end field.
 */
function entityInput<S extends z.ZodType>(
	schema: S,
	values: object
): Outcome<{ input: z.output<S> }> {
	const parsed = schema.safeParse(values);
	return parsed.success
		? { ok: true, input: parsed.data }
		: refuse('invalid', parsed.error.issues[0]!.message, 'end');
}

const changeForm = z.object({ bookingId: z.string().min(1), state: z.enum(BOOKING_STATES) });

export const actions: Actions = {
	book: async ({ locals, params, request, url }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const posted = await postedForm(request);
		if (!posted) return fail(400, { stepError: 'The form could not be read.' });
		const form = await validatePosted(posted, bookingFormSchema, {
			id: bookFormId(String(posted.get('campaignId') ?? ''))
		});
		if (!form.valid) return fail(400, { form });
		return saveSlotForm(
			form,
			facility.timeZone,
			(slot) => {
				const entity = entityInput(bookingSchema, { ...form.data, ...slot });
				if (!entity.ok) return entity;
				return createBooking(locals.db, user, facility.id, entity.input, url.origin);
			},
			'Slot booked.'
		);
	},

	move: async ({ locals, params, request, url }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const posted = await postedForm(request);
		if (!posted) return fail(400, { stepError: 'The form could not be read.' });
		const bookingId = String(posted.get('bookingId') ?? '');
		const found = findBookingFor(locals.db, user, bookingId, facility.id);
		if (!found.ok) error(STATUS_OF_REFUSAL[found.code], { message: found.message });
		const form = await validatePosted(posted, bookingMoveFormSchema, {
			id: `move-${bookingId}`
		});
		if (!form.valid) return fail(400, { form });
		return saveSlotForm(
			form,
			facility.timeZone,
			(slot) =>
				withBaseVersion(postedBaseVersion(posted), (base) =>
					changeBooking(locals.db, user, bookingId, slot, base, url.origin)
				),
			'Slot moved.'
		);
	},

	change: async ({ locals, params, request, url }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const body = await postedForm(request);
		const posted = Object.fromEntries(body ?? []);
		const found = findBookingFor(locals.db, user, String(posted.bookingId ?? ''), facility.id);
		if (!found.ok) error(STATUS_OF_REFUSAL[found.code], { message: found.message });
		const parsed = changeForm.safeParse(posted);
		if (!parsed.success) return fail(400, { stepError: 'Choose what the slot becomes.' });
		const changed = withBaseVersion(postedBaseVersion(body), (base) =>
			changeBooking(
				locals.db,
				user,
				found.booking.id,
				{ state: parsed.data.state },
				base,
				url.origin
			)
		);
		if (!changed.ok)
			return 'stale' in changed
				? fail(409, { stepError: staleSentence(changed.stale) })
				: fail(STATUS_OF_REFUSAL[changed.code], { stepError: changed.message });
		return { changed: parsed.data.state };
	},

	close: async ({ locals, params, request }) => {
		const { user, facility } = bookersFacility(locals, params.id);
		const form = await validatePosted(request, closureFormSchema, { id: CLOSURE_FORM_ID });
		if (!form.valid) return fail(400, { form });
		return saveSlotForm(
			form,
			facility.timeZone,
			(slot) => {
				const entity = entityInput(closureSchema, { ...form.data, ...slot });
				if (!entity.ok) return entity;
				return createClosure(locals.db, user, facility.id, entity.input);
			},
			'Closure entered.'
		);
	}
};
