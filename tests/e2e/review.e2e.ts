import Database from 'better-sqlite3';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchBrowser, ownOrigin, signIn, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const CAMPAIGN = 'Dock enclosure roof pressures';

async function as(email: string): Promise<Page> {
	const page = await (await browser.newContext()).newPage();
	await signIn(page, email);
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
	return page;
}

/** What the app's local fake SMTP server has received, read from the test database. */
function caughtSubjects(): { subject: string; to: string }[] {
	const db = new Database(inject('databasePath'), { readonly: true });
	try {
		return db.prepare('select subject, "to" from caught_mail order by created_at').all() as {
			subject: string;
			to: string;
		}[];
	} finally {
		db.close();
	}
}

describe('review of a campaign', () => {
	it('goes from submission through changes requested to approval, with notices by e-mail', async () => {
		const owner = await as('aero2@demo.test');
		await owner.getByRole('link', { name: CAMPAIGN }).click();
		await owner.getByRole('button', { name: 'Submit for review' }).click();
		await owner.getByTestId('campaign-state').getByText('in-review').waitFor();
		const campaignUrl = owner.url();

		const reviewer = await as('reviewer@demo.test');
		await reviewer.goto(url('/review'));
		await reviewer.getByRole('link', { name: CAMPAIGN }).click();
		await reviewer.getByRole('heading', { name: 'Your decision' }).waitFor();
		await reviewer.getByLabel('Return for changes').check();
		await reviewer.getByLabel('Summary').fill('One more speed, please.');
		await reviewer.getByRole('button', { name: 'Pin a note to Speed 12 m/s' }).click();
		await reviewer
			.getByLabel('Note 1', { exact: true })
			.fill('Add 15 m/s to show the pressures do not change with Re.');
		await reviewer.getByRole('button', { name: 'Record decision' }).click();
		await reviewer.getByTestId('decision').getByText('Decision: return').waitFor();

		await owner.goto(`${campaignUrl}/edit`);
		const note = owner.getByTestId('field-note');
		await note.waitFor();
		expect(await note.textContent()).toContain('Speed 12 m/s: Add 15 m/s');
		await owner.waitForLoadState('networkidle');
		await owner.getByLabel('Tunnel speeds (comma-separated)').fill('12, 15');
		await owner.getByRole('button', { name: 'Save draft' }).click();
		await owner.waitForURL(campaignUrl);
		await owner.getByRole('button', { name: 'Submit for review' }).click();
		await owner.getByTestId('campaign-state').getByText('in-review').waitFor();

		await reviewer.goto(`${campaignUrl}/revisions/2`);
		const diff = reviewer.getByTestId('revision-diff');
		await diff.waitFor();
		expect(await diff.textContent()).toContain('added 15');
		await reviewer.getByLabel('Approve').check();
		await reviewer.getByRole('button', { name: 'Record decision' }).click();
		await reviewer.getByTestId('decision').getByText('Decision: approve').waitFor();

		await owner.goto(campaignUrl);
		await owner.getByTestId('campaign-state').getByText('approved').waitFor();

		const expected = [
			`For review: ${CAMPAIGN} (revision 1)`,
			`${CAMPAIGN}: revision 1 returned for changes`,
			`For review: ${CAMPAIGN} (revision 2)`,
			`${CAMPAIGN}: revision 2 approved`
		];
		await expect
			.poll(
				() =>
					caughtSubjects()
						.map((m) => m.subject)
						.filter((s) => s.includes(CAMPAIGN)),
				{ timeout: 20_000 }
			)
			.toEqual(expected);
		const notices = caughtSubjects().filter((m) => m.subject.includes(CAMPAIGN));
		expect(notices.map((m) => JSON.parse(m.to))).toEqual([
			['reviewer@demo.test'],
			['aero2@demo.test'],
			['reviewer@demo.test'],
			['aero2@demo.test']
		]);
	});

	it('answers 409 with the reason to a decision on a campaign that is not in review', async () => {
		const reviewer = await as('reviewer@demo.test');
		await reviewer.goto(url('/review'));
		const queued = await reviewer.context().request.get(url('/api/v1/review-queue'));
		const { queue } = await queued.json();
		const waiting = queue[0];
		const first = await reviewer
			.context()
			.request.post(url(`/api/v1/campaigns/${waiting.id}/decisions`), {
				headers: ownOrigin(),
				data: { revision: waiting.revision, verdict: 'approve', summary: '', notes: [] }
			});
		expect(first.status()).toBe(201);
		const again = await reviewer
			.context()
			.request.post(url(`/api/v1/campaigns/${waiting.id}/decisions`), {
				headers: ownOrigin(),
				data: { revision: waiting.revision, verdict: 'decline', summary: 'Too late.', notes: [] }
			});
		expect(again.status()).toBe(409);
		expect((await again.json()).error.message).toMatch(
			/Cannot decline a campaign that is approved/
		);
	});
});
