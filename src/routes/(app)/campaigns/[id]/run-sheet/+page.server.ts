import { error } from '@sveltejs/kit';
import { runSheet } from '$lib/campaign/run-sheet';
import { utcMinute } from '$lib/format';
import { figuresOrProblem } from '$lib/server/campaign-export';
import { getCampaignFor } from '$lib/server/campaigns';
import { requireUser } from '$lib/server/guards';
import { readingsOverview } from '$lib/server/readings';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => {
	const user = requireUser(locals);
	const found = getCampaignFor(locals.db, user, params.id);
	if (!found) error(404, { message: 'No such campaign.' });
	const { figures, problem } = figuresOrProblem(found);
	if (!figures) error(409, { message: problem });
	return {
		campaign: found,
		sheet: runSheet(figures.plan, figures.timing),
		speeds: figures.speeds,
		tunnelAir: figures.tunnelAir,
		findings: figures.findings,
		printedAt: utcMinute(new Date()),
		readings: readingsOverview(locals.db, user, found.id)
	};
};
