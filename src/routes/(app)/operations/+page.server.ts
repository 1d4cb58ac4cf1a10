import { bookableCampaigns } from '$lib/server/bookings';
import { listFacilities } from '$lib/server/facilities';
import { requirePermission } from '$lib/server/guards';
import { SCHEDULE_WEEKS, upcomingSchedule } from '$lib/server/schedule';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	requirePermission(locals, 'book-tunnel-time');
	return {
		facilities: listFacilities(locals.db).map((f) => ({
			...f,
			waiting: bookableCampaigns(locals.db, f.id).filter((c) => c.occupancy_s > c.booked_s).length
		})),
		schedule: upcomingSchedule(locals.db, new Date()),
		weeks: SCHEDULE_WEEKS
	};
};
