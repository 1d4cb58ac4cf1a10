import { error } from '@sveltejs/kit';
import { csvDownload } from '$lib/server/csv-download';
import { requireUser } from '$lib/server/guards';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import { readingsTemplate } from '$lib/server/readings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ locals, params }) => {
	const user = requireUser(locals);
	const template = readingsTemplate(locals.db, user, params.id);
	if (!template.ok) error(STATUS_OF_REFUSAL[template.code], { message: template.message });
	return csvDownload(template.csv, template.name, `r${template.revision}-readings.csv`);
};
