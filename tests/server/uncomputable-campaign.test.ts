import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { GET as matrixCsv } from '../../src/routes/(app)/campaigns/[id]/matrix.csv/+server';
import { load as runSheet } from '../../src/routes/(app)/campaigns/[id]/run-sheet/+page.server';
import { createCampaign } from '../../src/lib/server/campaigns';
import { facility } from '../../src/lib/server/db/schema';
import { campaignWorld } from './campaign-fixtures';
import { callRoute } from './call-route';
import { tempDb } from './temp-db';

describe('a campaign whose facility changed so its figures cannot be computed', () => {
	const uncomputable = () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = createCampaign(db, w.aeroA, w.input());
		if (!created.ok) throw new Error(created.message);
		// A test section shrunk below the model's frontal area leaves no blockage correction.
		db.update(facility)
			.set({ sectionWidth_m: 0.05, sectionHeight_m: 0.05, cornerFillet_m: 0 })
			.where(eq(facility.id, w.tunnel))
			.run();
		return { db, w, id: created.id };
	};

	it('answers the run sheet with the reason, not a server error', async () => {
		const { db, w, id } = uncomputable();
		const answer = await callRoute(runSheet as never, db, w.aeroA, { params: { id } });
		expect(answer.status).toBe(409);
		expect(JSON.stringify(answer.body)).toMatch(/cannot be computed/);
	});

	it('answers the matrix CSV with the reason, not a server error', async () => {
		const { db, w, id } = uncomputable();
		const answer = await callRoute(matrixCsv as never, db, w.aeroA, { params: { id } });
		expect(answer.status).toBe(409);
		expect(String(answer.body)).toMatch(/cannot be computed/);
	});
});
