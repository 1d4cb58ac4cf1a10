import { fail, redirect, type RequestEvent } from '@sveltejs/kit';
import type { SuperValidated } from 'sveltekit-superforms';
import { campaignSchema, type CampaignInput } from '../schemas/campaign';
import { postedBaseVersion, refusedForm } from './form-versions';
import { postedForm, validatePosted } from './forms';
import type { Refusal } from './outcome';
import type { BaseVersion, StaleRefusal } from './versions';

const FIELDS = new Set(['name', 'modelId', 'facilityId', 'speeds_mps', 'yawAngles_deg']);

/**
 * Validates a posted campaign form and saves it with `save`, which gets the version the form
 * was opened at (null on the new-campaign page); refusals land on their field so the user sees
 * them beside what they typed, and nothing is written.
 */
export async function saveCampaignForm(
	event: RequestEvent,
	save: (
		input: CampaignInput,
		base: BaseVersion | null
	) => { ok: true; id?: string } | Refusal | StaleRefusal,
	redirectTo: (id: string | undefined) => string
) {
	const posted = await postedForm(event.request);
	const form: SuperValidated<CampaignInput> = await validatePosted(posted, campaignSchema);
	if (!form.valid) return fail(400, { form });
	const saved = save(form.data, postedBaseVersion(posted));
	if (!saved.ok)
		return refusedForm(form, saved, saved.field && FIELDS.has(saved.field) ? saved.field : '');
	redirect(303, redirectTo(saved.id));
}
