import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { campaign } from '../../src/lib/server/db/schema';
import { campaignSchema } from '../../src/lib/schemas/campaign';
import { canEditCampaign, canReadCampaign, canReadModel } from '../../src/lib/server/access';
import {
	createCampaign,
	deleteCampaign,
	getCampaignFor,
	listCampaignsFor,
	updateCampaign
} from '../../src/lib/server/campaigns';
import { getModelFor, listModelsFor } from '../../src/lib/server/models';
import type { Role, SessionUser } from '../../src/lib/roles';
import { campaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';

describe('who reads and edits a campaign', () => {
	const team = { id: 'A', name: 'A', kind: 'client' as const };
	const as = (roles: Role[], id = 'u', teams = [team]): SessionUser => ({
		id,
		email: `${id}@x`,
		name: id,
		roles,
		teams
	});
	const draft = { teamId: 'A', ownerId: 'owner', state: 'draft' as const, lastRevision: 0 };

	it.each<[string, SessionUser, boolean, boolean]>([
		['the owner', as(['aerodynamicist'], 'owner'), true, true],
		['a teammate', as(['aerodynamicist'], 'mate'), true, false],
		[
			'an aerodynamicist of another team',
			as(['aerodynamicist'], 'other', [{ id: 'B', name: 'B', kind: 'client' }]),
			false,
			false
		],
		['a reviewer, before submission', as(['reviewer'], 'rev', []), false, false],
		['an operator, before submission', as(['operator'], 'op', []), false, false],
		['an admin', as(['admin'], 'adm', []), true, false],
		['the owner without the aerodynamicist role any more', as(['reviewer'], 'owner'), false, false]
	])('%s: read %s, edit %s', (_, viewer, read, edit) => {
		expect(canReadCampaign(viewer, draft)).toBe(read);
		expect(canEditCampaign(viewer, draft)).toBe(edit);
	});

	it('shows facility staff a campaign once it has been submitted, its later drafts too', () => {
		const submitted = { ...draft, state: 'in-review' as const, lastRevision: 1 };
		const returned = { ...draft, lastRevision: 1 };
		for (const role of ['reviewer', 'operator'] as const) {
			expect(canReadCampaign(as([role], 'staff', []), submitted)).toBe(true);
			expect(canReadCampaign(as([role], 'staff', []), returned)).toBe(true);
			expect(canEditCampaign(as([role], 'staff', []), returned)).toBe(false);
		}
		expect(canEditCampaign(as(['aerodynamicist'], 'owner'), submitted)).toBe(false);
		expect(canEditCampaign(as(['aerodynamicist'], 'owner'), returned)).toBe(true);
	});

	it('keeps models within their team', () => {
		expect(canReadModel(as(['aerodynamicist']), { teamId: 'A' })).toBe(true);
		expect(canReadModel(as(['aerodynamicist']), { teamId: 'B' })).toBe(false);
		expect(canReadModel(as(['reviewer']), { teamId: 'A' })).toBe(false);
		expect(canReadModel(as(['admin'], 'adm', []), { teamId: 'B' })).toBe(true);
	});
});

describe('campaign drafts', () => {
	it('are created in the model’s team and seen only there', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = createCampaign(db, w.aeroA, w.input());
		expect(created.ok).toBe(true);
		if (!created.ok) return;
		expect(getCampaignFor(db, w.aeroA2, created.id)?.teamId).toBe(w.clientA);
		expect(getCampaignFor(db, w.aeroB, created.id)).toBeUndefined();
		expect(getCampaignFor(db, w.reviewer, created.id)).toBeUndefined();
		expect(getCampaignFor(db, w.admin, created.id)).toBeDefined();
		expect(listCampaignsFor(db, w.aeroB)).toEqual([]);
		// Drafts never submitted stay out of the staff's listings, as canReadCampaign says.
		expect(listCampaignsFor(db, w.reviewer)).toEqual([]);
		db.update(campaign).set({ lastRevision: 1 }).where(eq(campaign.id, created.id)).run();
		expect(listCampaignsFor(db, w.reviewer).map((c) => c.id)).toEqual([created.id]);
		expect(listCampaignsFor(db, w.aeroA).map((c) => c.id)).toEqual([created.id]);
		expect(listModelsFor(db, w.aeroB).map((m) => m.id)).toEqual([w.modelB]);
		expect(getModelFor(db, w.aeroB, w.modelA)).toBeUndefined();
	});

	it('cannot use another team’s model', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		expect(createCampaign(db, w.aeroA, w.input(w.modelB))).toMatchObject({
			ok: false,
			field: 'modelId'
		});
		expect(listCampaignsFor(db, w.admin)).toEqual([]);
	});

	it('refuse speeds and yaw angles outside the facility’s envelope, naming the field', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		expect(createCampaign(db, w.aeroA, { ...w.input(), speeds_mps: [30, 75] })).toMatchObject({
			ok: false,
			field: 'speeds_mps',
			message: expect.stringMatching(/75 m\/s is above the facility's maximum/)
		});
		expect(createCampaign(db, w.aeroA, { ...w.input(), yawAngles_deg: [0, 45] })).toMatchObject({
			ok: false,
			field: 'yawAngles_deg'
		});
		expect(listCampaignsFor(db, w.admin)).toEqual([]);
	});

	it('are changed and deleted by their owner only', () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const created = createCampaign(db, w.aeroA, w.input());
		if (!created.ok) throw new Error(created.message);
		const renamed = { ...w.input(), name: 'Renamed sweep' };
		expect(updateCampaign(db, w.aeroA2, created.id, renamed, 1)).toMatchObject({
			ok: false,
			code: 'forbidden'
		});
		expect(updateCampaign(db, w.aeroB, created.id, renamed, 1)).toMatchObject({
			ok: false,
			code: 'not-found'
		});
		expect(updateCampaign(db, w.aeroA, created.id, renamed, 1)).toEqual({ ok: true, version: 2 });
		expect(getCampaignFor(db, w.aeroA, created.id)?.name).toBe('Renamed sweep');
		expect(deleteCampaign(db, w.aeroB, created.id)).toMatchObject({ code: 'not-found' });
		expect(deleteCampaign(db, w.aeroA2, created.id)).toMatchObject({ code: 'forbidden' });
		expect(deleteCampaign(db, w.aeroA, created.id)).toEqual({ ok: true });
		expect(getCampaignFor(db, w.admin, created.id)).toBeUndefined();
	});
});

describe('campaign schema', () => {
	const base = () => campaignWorld(tempDb()).input();

	it.each<[string, (c: ReturnType<typeof base>) => unknown, string]>([
		['a duplicate speed', (c) => ({ ...c, speeds_mps: [20, 25, 20] }), 'speeds_mps'],
		['a duplicate yaw angle', (c) => ({ ...c, yawAngles_deg: [0, 0] }), 'yawAngles_deg'],
		['a zero speed', (c) => ({ ...c, speeds_mps: [0] }), 'speeds_mps.0'],
		[
			'no baseline',
			(c) => ({ ...c, configurations: c.configurations.map((x) => ({ ...x, baseline: false })) }),
			'configurations'
		],
		[
			'a plane over 10 000 points',
			(c) => ({
				...c,
				planes: [
					{
						...c.planes[0]!,
						grid: {
							mode: 'uniform',
							rows: 101,
							columns: 100,
							rowSpacing_m: 0.01,
							columnSpacing_m: 0.01,
							firstRow_m: 0,
							firstColumn_m: 0
						}
					}
				]
			}),
			'planes.0.grid'
		],
		[
			'a matrix over 250 000 points',
			(c) => ({
				...c,
				repeats: 20,
				speeds_mps: Array.from({ length: 20 }, (_, i) => 10 + i),
				yawAngles_deg: Array.from({ length: 10 }, (_, i) => i),
				planes: [
					{
						...c.planes[0]!,
						grid: {
							mode: 'uniform',
							rows: 10,
							columns: 10,
							rowSpacing_m: 0.01,
							columnSpacing_m: 0.01,
							firstRow_m: 0,
							firstColumn_m: 0
						}
					}
				]
			}),
			'planes'
		]
	])('refuses %s at its field', (_, change, path) => {
		const parsed = campaignSchema.safeParse(change(base()));
		expect(parsed.success).toBe(false);
		expect(parsed.error?.issues.map((i) => i.path.join('.'))).toContain(path);
	});
});
