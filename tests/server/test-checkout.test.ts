import { eq } from 'drizzle-orm';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Db } from '../../src/lib/server/db/open';
import { documentNumber } from '../../src/lib/billing/numbers';
import { fakeCheckoutSession, invoice } from '../../src/lib/server/db/schema';
import { startCheckout } from '../../src/lib/server/payments/checkout';
import type { PaymentService } from '../../src/lib/server/payments/service';
import {
	payTestCheckout,
	testCheckoutCancelUrl,
	testCheckoutView
} from '../../src/lib/server/payments/test-checkout';
import { POST as webhook } from '../../src/routes/api/v1/payments/webhook/+server';
import { approvedCampaignWorld } from './campaign-fixtures';
import { requestEvent } from './request-event';
import { addInvoice, ORIGIN, standIn } from './payment-fixtures';
import { tempDb } from './temp-db';

const servers: Server[] = [];
afterEach(async () => {
	vi.restoreAllMocks();
	for (const server of servers.splice(0)) await new Promise((done) => server.close(done));
});

/** The webhook route behind a real HTTP listener, as the app serves it. */
async function webhookListener(db: Db): Promise<string> {
	const server = createServer(async (request, response) => {
		const chunks: Buffer[] = [];
		for await (const chunk of request) chunks.push(chunk as Buffer);
		const answer = (await webhook(
			requestEvent({
				db,
				method: 'POST',
				path: request.url,
				raw: Buffer.concat(chunks),
				headers: { 'stripe-signature': String(request.headers['stripe-signature'] ?? '') }
			}) as never
		)) as Response;
		response.writeHead(answer.status, { 'content-type': 'application/json' });
		response.end(await answer.text());
	});
	servers.push(server);
	await new Promise<void>((ready) => server.listen(0, '127.0.0.1', ready));
	return `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/v1/payments/webhook`;
}

async function openCheckout(db: Db, service: PaymentService) {
	const w = approvedCampaignWorld(db, ORIGIN);
	const bill = addInvoice(db, w, { total: '1234.50' });
	const urls = { successUrl: `${ORIGIN}/done`, cancelUrl: `${ORIGIN}/back` };
	const started = await startCheckout(db, bill, urls, service);
	if (!started.ok) throw new Error(started.message);
	const sessionId = db.select().from(invoice).where(eq(invoice.id, bill.id)).get()!
		.checkoutSessionId!;
	return { bill, sessionId };
}

describe('the stand-in checkout page', () => {
	it('shows the amount in the major unit and the description, and where Cancel goes', async () => {
		const db = tempDb();
		const service = await standIn(db);
		const { bill, sessionId } = await openCheckout(db, service);
		expect(testCheckoutView(db, service, sessionId)).toEqual({
			id: sessionId,
			description: `Tern closed-return tunnel, invoice ${documentNumber(bill.number)}`,
			amount: '1234.50',
			currency: 'EUR',
			open: true
		});
		expect(testCheckoutCancelUrl(db, service, sessionId)).toBe(`${ORIGIN}/back`);
		expect(testCheckoutView(db, service, 'cs_test_unknown')).toBeUndefined();
		const realService = { ...service, testCheckout: false };
		expect(testCheckoutView(db, realService, sessionId)).toBeUndefined();
		expect(testCheckoutCancelUrl(db, realService, sessionId)).toBeUndefined();
	});

	it('pays through a signed event over HTTP to the webhook, once', async () => {
		const db = tempDb();
		const service = await standIn(db);
		const { bill, sessionId } = await openCheckout(db, service);
		const url = await webhookListener(db);
		expect(await payTestCheckout(db, service, sessionId, url)).toEqual({
			ok: true,
			successUrl: `${ORIGIN}/done`
		});
		const paid = db.select().from(invoice).where(eq(invoice.id, bill.id)).get()!;
		expect(paid.paidAt).toBeInstanceOf(Date);
		expect(paid.paymentEventId).toMatch(/^evt_test_/);
		expect(testCheckoutView(db, service, sessionId)?.open).toBe(false);
		expect(await payTestCheckout(db, service, sessionId, url)).toMatchObject({
			ok: false,
			code: 'conflict'
		});
	});

	it('leaves the session open to try again when the webhook does not take the event', async () => {
		const db = tempDb();
		const service = await standIn(db);
		const { bill, sessionId } = await openCheckout(db, service);
		const url = await webhookListener(db);
		const warn = vi.spyOn(console, 'warn').mockImplementation(() => {});
		const otherSecret = { ...service, webhookSecret: 'whsec_not-the-apps' };
		expect(await payTestCheckout(db, otherSecret, sessionId, url)).toMatchObject({
			ok: false,
			code: 'conflict'
		});
		const session = db
			.select()
			.from(fakeCheckoutSession)
			.where(eq(fakeCheckoutSession.id, sessionId))
			.get()!;
		expect([session.status, session.paymentStatus]).toEqual(['open', 'unpaid']);
		expect(warn).toHaveBeenCalledOnce();
		expect(db.select().from(invoice).where(eq(invoice.id, bill.id)).get()!.paidAt).toBeNull();
	});
});
