import { error } from '@sveltejs/kit';
import { invoiceQuerySchema } from '$lib/schemas/billing';
import { can } from '$lib/server/access';
import { listInvoices } from '$lib/server/billing';
import { listFacilities } from '$lib/server/facilities';
import { requireRole } from '$lib/server/guards';
import { listTeams } from '$lib/server/users';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const user = requireRole(locals, 'aerodynamicist', 'operator', 'admin');
	const query = invoiceQuerySchema.safeParse(Object.fromEntries(url.searchParams));
	if (!query.success) error(400, { message: 'Bad filter.' });
	const page = listInvoices(locals.db, user, query.data);
	if (!page.ok) error(400, { message: page.message });
	const staff = can(user, 'manage-billing');
	return {
		filter: query.data,
		staff,
		facilities: staff ? listFacilities(locals.db).map((f) => ({ id: f.id, name: f.name })) : [],
		teams: staff ? listTeams(locals.db).filter((t) => t.kind === 'client') : [],
		invoices: page.invoices,
		next: page.next
	};
};
