import { eq } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import { transition, type CampaignAction } from '../../workflow';
import { campaignActor, canReadCampaign } from '../access';
import type { DbOrTx } from '../db/open';
import { campaign } from '../db/schema';
import { refuse } from '../outcome';

/** The campaign row if the viewer may read it; undefined answers 404 alike for none and hidden. */
export function readableCampaign(db: DbOrTx, viewer: SessionUser, campaignId: string) {
	const c = db.select().from(campaign).where(eq(campaign.id, campaignId)).get();
	return c && canReadCampaign(viewer, c) ? c : undefined;
}

/** Loads the campaign for an action and checks it against the workflow's transition table. */
export function checkedStep(
	tx: DbOrTx,
	viewer: SessionUser,
	campaignId: string,
	action: CampaignAction
) {
	const c = readableCampaign(tx, viewer, campaignId);
	if (!c) return { ok: false as const, refusal: refuse('not-found', 'No such campaign.') };
	const step = transition(c.state, action, campaignActor(viewer, c));
	if (!step.ok) return { ok: false as const, refusal: step };
	return { ok: true as const, campaign: c, to: step.to };
}
