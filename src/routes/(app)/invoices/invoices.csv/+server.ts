import { error } from '@sveltejs/kit';
import { utcDay } from '$lib/format';
import { invoiceQuerySchema } from '$lib/schemas/billing';
import { invoicesCsv } from '$lib/server/billing';
import { csvDownload } from '$lib/server/csv-download';
import { requireRole } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, url }) => {
	const user = requireRole(locals, 'aerodynamicist', 'operator', 'admin');
	const query = invoiceQuerySchema
		.omit({ after: true })
		.safeParse(Object.fromEntries(url.searchParams));
	if (!query.success) error(400, { message: 'Bad filter.' });
	return csvDownload(
		invoicesCsv(locals.db, user, query.data),
		'invoices',
		`${utcDay(Date.now())}.csv`
	);
};
