import { stringify } from 'devalue';
import { describe, expect, it } from 'vitest';
import { DEMO_CAMPAIGNS } from '../../scripts/demo-scenario';
import { MATRIX_LIST_LIMITS } from '../../src/lib/calc';
import { campaignSchema } from '../../src/lib/schemas/campaign';
import { facilityDefaults, facilitySchema } from '../../src/lib/schemas/facility';
import { UNREADABLE_FORM, validatePosted } from '../../src/lib/server/forms';

/** A form as superforms' client posts it: the data devalue-encoded in one field. */
function jsonForm(data: unknown): FormData {
	const posted = new FormData();
	posted.set('__superform_json', stringify(data));
	return posted;
}

const campaign = { ...DEMO_CAMPAIGNS[1]!.input, modelId: 'm', facilityId: 'f' };

describe('a posted form whose shape is not the form’s', () => {
	it('comes back empty with a form-level error when a plane has no probe grid', async () => {
		// superforms hands this back as posted, and the editor cannot render a plane without a grid.
		const planes = campaign.planes.map(({ grid: _grid, ...plane }) => plane);
		const form = await validatePosted(jsonForm({ ...campaign, planes }), campaignSchema);
		expect(form.valid).toBe(false);
		expect(form.errors._errors).toEqual([UNREADABLE_FORM]);
		expect(form.data.planes).toEqual([]);
	});

	it('comes back empty when the body is a list, on which superforms throws', async () => {
		const form = await validatePosted(jsonForm([facilityDefaults()]), facilitySchema);
		expect(form.valid).toBe(false);
		expect(form.errors._errors).toEqual([UNREADABLE_FORM]);
	});

	it('comes back empty for a variant the form does not have', async () => {
		const planes = campaign.planes.map((p) => ({ ...p, grid: { ...p.grid, mode: 'spiral' } }));
		const form = await validatePosted(jsonForm({ ...campaign, planes }), campaignSchema);
		expect(form.errors._errors).toEqual([UNREADABLE_FORM]);
	});

	it('keeps a well-shaped form with values out of range, with the errors at their fields', async () => {
		const form = await validatePosted(
			jsonForm({ ...campaign, name: '', speeds_mps: [-4] }),
			campaignSchema
		);
		expect(form.valid).toBe(false);
		expect(form.errors._errors).toBeUndefined();
		expect(form.errors.name).toBeDefined();
		expect(form.data.speeds_mps).toEqual([-4]);
	});

	it('cuts a list longer than the form allows, keeping its error', async () => {
		const yawAngles_deg = Array.from({ length: 5000 }, (_, i) => -180 + i * 0.072);
		const form = await validatePosted(jsonForm({ ...campaign, yawAngles_deg }), campaignSchema);
		expect(form.errors.yawAngles_deg?._errors?.[0]).toMatch(/at most/i);
		expect(form.data.yawAngles_deg).toEqual(yawAngles_deg.slice(0, MATRIX_LIST_LIMITS.yawAngles));
	});

	it('passes a valid form through', async () => {
		const facility = { ...facilityDefaults(), name: 'Return-circuit tunnel' };
		const form = await validatePosted(jsonForm(facility), facilitySchema);
		expect(form.valid).toBe(true);
		expect(form.data).toEqual(facility);
	});
});
