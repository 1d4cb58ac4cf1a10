import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_CAMPAIGNS } from '../../scripts/demo-scenario';
import { launchBrowser, ownOrigin, signedInPage, url } from './browser';
import { addTestCheckoutSession } from './test-checkout-session';

// axe-core is put into the page as an inline script, which the app's CSP rightly refuses.
const AUDIT = { bypassCSP: true };

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const AXE_SOURCE = readFileSync(
	createRequire(import.meta.url).resolve('axe-core/axe.min.js'),
	'utf8'
);
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
const APPROVED = 'Heron-4 forward-flight wake';
const EDITABLE = 'AM-3 speed sweep';

type Finding = { id: string; impact: string | null; help: string; targets: string[] };

/** The serious and critical WCAG A/AA findings on the page as it is shown now. */
async function audit(page: Page): Promise<Finding[]> {
	if (!(await page.evaluate(() => 'axe' in window)))
		await page.addScriptTag({ content: AXE_SOURCE });
	return page.evaluate(async (tags) => {
		type Axe = {
			run: (
				context: Document,
				options: object
			) => Promise<{
				violations: {
					id: string;
					impact: string | null;
					help: string;
					nodes: { target: unknown[] }[];
				}[];
			}>;
		};
		const { violations } = await (window as unknown as { axe: Axe }).axe.run(document, {
			runOnly: { type: 'tag', values: tags }
		});
		return violations
			.filter((v) => v.impact === 'serious' || v.impact === 'critical')
			.map((v) => ({
				id: v.id,
				impact: v.impact,
				help: v.help,
				targets: v.nodes.slice(0, 5).map((n) => n.target.join(' '))
			}));
	}, WCAG_AA);
}

/** Audits `path` in light and dark, since every colour token has a value for each. */
async function findingsOn(page: Page, path: string): Promise<string[]> {
	await page.goto(url(path));
	await page.waitForLoadState('networkidle');
	const report: string[] = [];
	for (const colorScheme of ['light', 'dark'] as const) {
		await page.emulateMedia({ colorScheme });
		for (const f of await audit(page)) {
			report.push(
				`${path} [${colorScheme}] ${f.id} (${f.impact}): ${f.help} — ${f.targets.join(', ')}`
			);
		}
	}
	return report;
}

/** Audits every path before failing, so one run lists everything there is to fix. */
async function expectAccessible(page: Page, paths: string[]): Promise<void> {
	const report: string[] = [];
	for (const path of paths) report.push(...(await findingsOn(page, path)));
	expect(report, report.join('\n')).toEqual([]);
}

type Listed = { id: string; name: string; state?: string };

async function listed(page: Page, path: string, key: string): Promise<Listed[]> {
	return (await (await page.context().request.get(url(path))).json())[key];
}

async function campaignId(page: Page, name: string): Promise<string> {
	return (await listed(page, '/api/v1/campaigns', 'campaigns')).find((c) => c.name === name)!.id;
}

/**
 * A draft of the signed-in owner's to open in the editor. Other files may have submitted the
 * seeded one already, so a copy is written when none is left.
 */
async function draftId(page: Page): Promise<string> {
	const draft = (await listed(page, '/api/v1/campaigns', 'campaigns')).find(
		(c) => c.state === 'draft'
	);
	if (draft) return draft.id;
	const seed = DEMO_CAMPAIGNS.find((c) => c.input.name === EDITABLE)!;
	const byName = async (path: string, key: string, name: string) =>
		(await listed(page, path, key)).find((x) => x.name === name)!.id;
	const created = await page.context().request.post(url('/api/v1/campaigns'), {
		headers: ownOrigin(),
		data: {
			...seed.input,
			name: `${EDITABLE} (accessibility copy)`,
			modelId: await byName('/api/v1/models', 'models', seed.model),
			facilityId: await byName('/api/v1/facilities', 'facilities', seed.facility)
		}
	});
	expect(created.status()).toBe(201);
	return (await created.json()).id;
}

describe('accessibility (WCAG 2.1 A and AA, serious and critical findings)', () => {
	it('the sign-in page', async () => {
		const page = await (await browser.newContext(AUDIT)).newPage();
		await expectAccessible(page, ['/signin']);
	});

	it("an aerodynamicist's pages", async () => {
		const page = await signedInPage(browser, 'aero@demo.test', AUDIT);
		const campaign = await campaignId(page, 'AM-7 rear-wing wake survey');
		const model = (await listed(page, '/api/v1/models', 'models'))[0]!.id;
		await expectAccessible(page, [
			'/campaigns',
			`/campaigns/${campaign}`,
			`/campaigns/${await draftId(page)}/edit`,
			'/models',
			`/models/${model}`,
			'/facilities',
			'/account',
			'/calendar-feed'
		]);
	});

	it("a reviewer's pages", async () => {
		const page = await signedInPage(browser, 'reviewer@demo.test', AUDIT);
		const approved = (await listed(page, '/api/v1/campaigns', 'campaigns')).find(
			(c) => c.name === APPROVED
		)!;
		await expectAccessible(page, ['/review', `/campaigns/${approved.id}/revisions/1`]);
	});

	it("an operator's pages", async () => {
		const page = await signedInPage(browser, 'operator@demo.test', AUDIT);
		const facility = (await listed(page, '/api/v1/facilities', 'facilities'))[0]!.id;
		await expectAccessible(page, ['/operations', `/facilities/${facility}/calendar`]);
	});

	it("an administrator's pages", async () => {
		const page = await signedInPage(browser, 'admin@demo.test', AUDIT);
		await expectAccessible(page, ['/admin', '/admin/outbox']);
	});

	it("the payment stand-in's checkout page", async () => {
		const page = await signedInPage(browser, 'aero@demo.test', AUDIT);
		const session = addTestCheckoutSession(inject('databasePath'), inject('baseUrl'));
		await expectAccessible(page, [`/payments/test-checkout/${session}`]);
	});

	it('an approved campaign and its run sheet', async () => {
		const page = await signedInPage(browser, 'aero2@demo.test', AUDIT);
		const approved = await campaignId(page, APPROVED);
		await expectAccessible(page, [`/campaigns/${approved}`, `/campaigns/${approved}/run-sheet`]);
	});

	it('a client team’s quote and invoices', async () => {
		const page = await signedInPage(browser, 'aero2@demo.test', AUDIT);
		const approved = await campaignId(page, APPROVED);
		const invoice = (await listed(page, `/api/v1/invoices?campaign=${approved}`, 'invoices'))[0]!;
		await expectAccessible(page, [
			`/campaigns/${approved}/quote`,
			'/invoices',
			`/invoices/${invoice.id}`
		]);
	});
});

describe('a phone-width screen', () => {
	it('never scrolls the campaign pages sideways; wide tables scroll in their own frame', async () => {
		const page = await signedInPage(browser, 'aero2@demo.test', AUDIT);
		await page.setViewportSize({ width: 390, height: 844 });
		const approved = await campaignId(page, APPROVED);
		for (const path of [
			'/campaigns',
			`/campaigns/${approved}`,
			`/campaigns/${approved}/run-sheet`,
			`/campaigns/${approved}/quote`
		]) {
			await page.goto(url(path));
			await page.waitForLoadState('networkidle');
			const width = await page.evaluate(() => document.documentElement.scrollWidth);
			expect(width, `${path} is ${width} px wide`).toBeLessThanOrEqual(390);
		}
	});
});
