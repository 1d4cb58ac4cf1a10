import { error, fail } from '@sveltejs/kit';
import { localToInstant, weekOf } from '$lib/booking/week';
import { openingWindows } from '$lib/booking/calendar';
import { bookingChangeSchema, bookingSchema, closureSchema } from '$lib/schemas/booking';
import { fieldMessages } from '$lib/server/api';
import {
	bookableCampaigns,
	changeBooking,
	createBooking,
	createClosure,
	listBookings,
	listClosures,
	proposeFor
} from '$lib/server/bookings';
import { getFacility } from '$lib/server/facilities';
import { requireRole, requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params, url }) => {
	const user = requireUser(locals);
	const facility = getFacility(locals.db, params.id);
	if (!facility) error(404, { message: 'No such facility.' });
	const day = url.searchParams.get('day');
	const week = weekOf(day ?? url.searchParams.get('week'), facility.timeZone);
	// The day view is one column of the same week, wider.
	const shown = day ? week.days.filter((d) => d.iso === day) : week.days;
	const canBook = user.roles.includes('operator') || user.roles.includes('admin');
	const now = Date.now();
	return {
		facility,
		week,
		view: day && shown.length ? ('day' as const) : ('week' as const),
		days: shown.length ? shown : week.days,
		bookings: listBookings(locals.db, user, facility.id, week.from, week.to),
		closures: listClosures(locals.db, facility.id, week.from, week.to),
		windows: openingWindows(
			facility.openingHours,
			facility.timeZone,
			week.from.getTime(),
			week.to.getTime()
		),
		canBook,
		bookable: canBook
			? bookableCampaigns(locals.db, facility.id).map((c) => ({
					...c,
					proposal: proposeFor(locals.db, facility.id, c.occupancy_s - c.booked_s, now)
				}))
			: []
	};
};

/** Reads a form's facility-local times into UTC instants before the shared schema checks them. */
function instants(form: FormData, timeZone: string, ...names: string[]) {
	const values: Record<string, unknown> = Object.fromEntries(form);
	for (const name of names) {
		const local = form.get(name);
		if (typeof local === 'string' && local) values[name] = localToInstant(local, timeZone) ?? local;
		else delete values[name];
	}
	return values;
}

export const actions: Actions = {
	book: async ({ locals, params, request, url }) => {
		const user = requireRole(locals, 'operator', 'admin');
		const facility = getFacility(locals.db, params.id);
		if (!facility) error(404, { message: 'No such facility.' });
		const parsed = bookingSchema.safeParse(
			instants(await request.formData(), facility.timeZone, 'start', 'end')
		);
		if (!parsed.success)
			return fail(400, {
				bookingError: Object.values(fieldMessages(parsed.error)).flat().join(' ')
			});
		const created = createBooking(locals.db, user, facility.id, parsed.data, url.origin);
		if (!created.ok)
			return fail(STATUS_OF_REFUSAL[created.code], { bookingError: created.message });
		return { booked: created.id };
	},
	change: async ({ locals, params, request, url }) => {
		const user = requireRole(locals, 'operator', 'admin');
		const facility = getFacility(locals.db, params.id);
		if (!facility) error(404, { message: 'No such facility.' });
		const form = await request.formData();
		const parsed = bookingChangeSchema.safeParse(instants(form, facility.timeZone, 'start', 'end'));
		if (!parsed.success)
			return fail(400, {
				bookingError: Object.values(fieldMessages(parsed.error)).flat().join(' ')
			});
		const changed = changeBooking(
			locals.db,
			user,
			String(form.get('bookingId')),
			parsed.data,
			url.origin
		);
		if (!changed.ok)
			return fail(STATUS_OF_REFUSAL[changed.code], { bookingError: changed.message });
		return { changed: true };
	},
	close: async ({ locals, params, request }) => {
		const user = requireRole(locals, 'operator', 'admin');
		const facility = getFacility(locals.db, params.id);
		if (!facility) error(404, { message: 'No such facility.' });
		const parsed = closureSchema.safeParse(
			instants(await request.formData(), facility.timeZone, 'start', 'end')
		);
		if (!parsed.success)
			return fail(400, {
				closureError: Object.values(fieldMessages(parsed.error)).flat().join(' ')
			});
		const created = createClosure(locals.db, user, facility.id, parsed.data);
		if (!created.ok)
			return fail(STATUS_OF_REFUSAL[created.code], { closureError: created.message });
		return { closed: created.id };
	}
};
