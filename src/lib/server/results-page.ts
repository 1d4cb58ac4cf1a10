import { error } from '@sveltejs/kit';
import { z } from 'zod';
import type { SessionUser } from '../roles';
import { getCampaignFor } from './campaigns';
import type { Db } from './db/open';
import { STATUS_OF_REFUSAL } from './outcome';
import { campaignResults, DEFAULT_SWEEP_TOLERANCE } from './results';

/** The query a results page, export or API call takes: the baseline and the sweep tolerance. */
export const resultsQuery = z.object({
	baseline: z.string().trim().min(1).max(64).optional(),
	tolerance: z.coerce.number().positive().max(0.5).default(DEFAULT_SWEEP_TOLERANCE)
});

/** What the results page and the printable report load: the campaign, its geometry, the results. */
export function resultsPageData(db: Db, viewer: SessionUser, campaignId: string, url: URL) {
	const found = getCampaignFor(db, viewer, campaignId);
	if (!found) error(404, { message: 'No such campaign.' });
	const query = resultsQuery.safeParse(Object.fromEntries(url.searchParams));
	if (!query.success)
		error(400, { message: 'The baseline or tolerance in the address is not valid.' });
	const reduced = campaignResults(db, viewer, campaignId, query.data);
	if (!reduced.ok) error(STATUS_OF_REFUSAL[reduced.code], { message: reduced.message });
	const scale = 1 / found.model.scaleDenominator;
	return {
		campaign: { id: found.id, name: found.name, state: found.state },
		model: {
			name: found.model.name,
			scaleDenominator: found.model.scaleDenominator,
			width_m: found.model.fullScaleWidth_m * scale,
			height_m: found.model.fullScaleHeight_m * scale
		},
		facility: {
			name: found.facility.name,
			sectionWidth_m: found.facility.sectionWidth_m,
			sectionHeight_m: found.facility.sectionHeight_m
		},
		tolerance: query.data.tolerance,
		results: reduced.results
	};
}
