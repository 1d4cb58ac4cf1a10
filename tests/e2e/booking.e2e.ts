import { DateTime } from 'luxon';
import type { APIRequestContext, Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, ownOrigin, signIn, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const CAMPAIGN = 'AM-3 speed sweep';
const TUNNEL = 'Tern closed-return tunnel';

async function as(email: string): Promise<Page> {
	const page = await (await browser.newContext()).newPage();
	await signIn(page, email);
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
	return page;
}

async function idOf(
	request: APIRequestContext,
	path: string,
	key: string,
	name: string
): Promise<string> {
	const body = await (await request.get(url(path))).json();
	return body[key].find((x: { name: string }) => x.name === name).id;
}

describe('booking tunnel time', () => {
	it('books an approved campaign from the calendar, shows it to the owner, and refuses an overlap', async () => {
		// The seed returned this campaign for changes; its owner resubmits and a reviewer approves.
		const owner = await as('aero@demo.test');
		const campaignId = await idOf(
			owner.context().request,
			'/api/v1/campaigns',
			'campaigns',
			CAMPAIGN
		);
		expect(
			(
				await owner
					.context()
					.request.post(url(`/api/v1/campaigns/${campaignId}/submit`), { headers: ownOrigin() })
			).status()
		).toBe(201);
		const reviewer = await as('reviewer@demo.test');
		const revision = (
			await (
				await reviewer.context().request.get(url(`/api/v1/campaigns/${campaignId}/revisions`))
			).json()
		).revisions.at(-1).number;
		const approved = await reviewer
			.context()
			.request.post(url(`/api/v1/campaigns/${campaignId}/decisions`), {
				headers: ownOrigin(),
				data: { revision, verdict: 'approve', summary: '', notes: [] }
			});
		expect(approved.status()).toBe(201);

		const operator = await as('operator@demo.test');
		await operator.getByRole('link', { name: `${TUNNEL} calendar` }).click();
		const offer = operator.getByTestId(`bookable-${CAMPAIGN}`);
		await offer.waitFor();
		const firstProposal = offer.locator('li').first();
		const proposed = (await firstProposal.locator('.figure').textContent())!;
		await firstProposal.getByRole('button', { name: 'Book' }).click();
		await operator.getByText('Slot booked.').waitFor();

		await owner.goto(url(`/campaigns/${campaignId}`));
		const slots = owner.getByTestId('campaign-slots');
		await slots.waitFor();
		expect(await slots.textContent()).toContain('pencilled');

		// The same times again, by hand: refused with the slot it collides with.
		const [, day, from, to] = proposed.match(
			/(\d{4}-\d{2}-\d{2})\s+(\d{2}:\d{2})\s*–\s*(\d{2}:\d{2})/
		)!;
		await offer.getByLabel('Start').fill(`${day}T${from}`);
		await offer.getByLabel('End').fill(`${day}T${to}`);
		await offer.getByRole('button', { name: 'Book this slot' }).click();
		const refusal = operator.getByRole('alert');
		await refusal.waitFor();
		expect(await refusal.textContent()).toMatch(/collides with booking/);
	});

	it('lets exactly one of 50 simultaneous requests for one slot win', async () => {
		const operator = await as('operator@demo.test');
		const request = operator.context().request;
		const tunnelId = await idOf(request, '/api/v1/facilities', 'facilities', TUNNEL);
		const campaignId = await idOf(request, '/api/v1/campaigns', 'campaigns', CAMPAIGN);
		// A Tuesday eight weeks out, 10:00–11:00 in the tunnel's time zone: inside opening hours.
		const start = DateTime.now()
			.setZone('Europe/Berlin')
			.plus({ weeks: 8 })
			.startOf('week')
			.plus({ days: 1, hours: 10 });
		const slot = {
			campaignId,
			start: start.toISO(),
			end: start.plus({ hours: 1 }).toISO(),
			note: ''
		};
		const answers = await Promise.all(
			Array.from({ length: 50 }, () =>
				request.post(url(`/api/v1/facilities/${tunnelId}/bookings`), {
					data: slot,
					headers: ownOrigin()
				})
			)
		);
		const statuses = answers.map((a) => a.status());
		expect(statuses.filter((s) => s === 201)).toHaveLength(1);
		expect(statuses.filter((s) => s === 409)).toHaveLength(49);
		const range = `from=${encodeURIComponent(start.toISO()!)}&to=${encodeURIComponent(start.plus({ hours: 1 }).toISO()!)}`;
		const held = (
			await (await request.get(url(`/api/v1/facilities/${tunnelId}/bookings?${range}`))).json()
		).bookings;
		expect(held).toHaveLength(1);
	});
});
