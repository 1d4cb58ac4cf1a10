import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { settingFindings } from '$lib/calc';
import { campaignSchema, type CampaignInput } from '$lib/schemas/campaign';
import { saveCampaignForm } from '$lib/server/campaign-form';
import { createCampaign } from '$lib/server/campaigns';
import { listFacilities } from '$lib/server/facilities';
import { requireRole } from '$lib/server/guards';
import { listModelsFor } from '$lib/server/models';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole(locals, 'aerodynamicist');
	const models = listModelsFor(locals.db, user);
	const facilities = listFacilities(locals.db);
	const facility = facilities[0];
	const startingSpeeds_mps = [20, 30, 40];
	// The starting speeds the facility can set, by the core's envelope check.
	const unreachable = new Set(
		facility ? settingFindings(startingSpeeds_mps, [], facility).map((f) => f.speed_mps) : []
	);
	const start: CampaignInput = {
		name: '',
		objective: '',
		modelId: url.searchParams.get('model') ?? models[0]?.id ?? '',
		facilityId: facility?.id ?? '',
		air: { model: 'isa', siteAltitude_m: facility?.siteAltitude_m ?? 0, temperatureOffset_K: 0 },
		fullScaleSpeed_mps: 30,
		fullScaleAltitude_m: 0,
		reIndependenceThreshold: null,
		speedUnit: 'm/s',
		configurations: [{ id: 'base', label: 'Baseline', description: '', baseline: true }],
		speeds_mps: startingSpeeds_mps.filter((v) => !unreachable.has(v)),
		yawAngles_deg: [0],
		planes: [
			{
				id: 'x1',
				label: 'One model length behind',
				downstream: { value: 1, unit: 'model-lengths' },
				grid: {
					mode: 'uniform',
					rows: 5,
					columns: 7,
					rowSpacing_m: 0.02,
					columnSpacing_m: 0.02,
					firstRow_m: 0.01,
					firstColumn_m: -0.06
				}
			}
		],
		dwellPerPoint_s: 10,
		repeats: 1
	};
	return {
		models,
		facilities,
		form: await superValidate(start, zod4(campaignSchema), { errors: false })
	};
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireRole(event.locals, 'aerodynamicist');
		return saveCampaignForm(
			event,
			(input) => createCampaign(event.locals.db, user, input),
			(id) => `/campaigns/${id}`
		);
	}
};
