import { fail, redirect, type RequestEvent } from '@sveltejs/kit';
import { setError, type SuperValidated } from 'sveltekit-superforms';
import { campaignSchema, type CampaignInput } from '../schemas/campaign';
import { validatePosted } from './forms';
import type { Refusal } from './outcome';
import { STATUS_OF_REFUSAL } from './outcome';

const FIELDS = new Set(['name', 'modelId', 'facilityId', 'speeds_mps', 'yawAngles_deg']);

/**
 * Validates a posted campaign form and saves it with `save`; refusals land on their field so
 * the user sees them beside what they typed, and nothing is written.
 */
export async function saveCampaignForm(
	event: RequestEvent,
	save: (input: CampaignInput) => { ok: true; id?: string } | Refusal,
	redirectTo: (id: string | undefined) => string
) {
	const form: SuperValidated<CampaignInput> = await validatePosted(event.request, campaignSchema);
	if (!form.valid) return fail(400, { form });
	const saved = save(form.data);
	if (!saved.ok) {
		const field = saved.field && FIELDS.has(saved.field) ? (saved.field as 'name') : '';
		return setError(form, field, saved.message, { status: STATUS_OF_REFUSAL[saved.code] });
	}
	redirect(303, redirectTo(saved.id));
}
