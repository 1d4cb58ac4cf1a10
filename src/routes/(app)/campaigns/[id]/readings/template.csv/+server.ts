import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import { readingsTemplate } from '$lib/server/readings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const template = readingsTemplate(locals.db, user, params.id);
	if (!template.ok) error(STATUS_OF_REFUSAL[template.code], { message: template.message });
	const stem = template.name.replace(/[^\w.-]+/g, '-').replace(/^-|-$/g, '') || 'campaign';
	return new Response(template.csv, {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="${stem}-r${template.revision}-readings.csv"`
		}
	});
};
