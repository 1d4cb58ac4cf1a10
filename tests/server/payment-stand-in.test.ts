import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import type { Db } from '../../src/lib/server/db/open';
import { fakeCheckoutSession } from '../../src/lib/server/db/schema';
import { startFakePaymentService } from '../../src/lib/server/payments/fake-service';
import { tempDb } from './temp-db';

const API_KEY = 'sk_test_stand-in';
const closing: (() => Promise<void>)[] = [];
afterEach(async () => {
	for (const close of closing.splice(0)) await close();
});

/** The stand-in on a loopback port, and the SDK pointed at it as the app points it. */
async function standIn(db: Db, apiKey = API_KEY) {
	const fake = await startFakePaymentService(db, API_KEY);
	closing.push(() => fake.close());
	const stripe = new Stripe(apiKey, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
	return { stripe, port: fake.port };
}

const NEW_SESSION: Stripe.Checkout.SessionCreateParams = {
	mode: 'payment',
	line_items: [
		{
			quantity: 2,
			price_data: {
				currency: 'eur',
				unit_amount: 61_725,
				product_data: { name: 'Tern closed-return tunnel, invoice 7' }
			}
		}
	],
	client_reference_id: 'inv-1',
	metadata: { invoiceId: 'inv-1' },
	success_url: 'http://localhost:5173/invoices/inv-1?paid=1',
	cancel_url: 'http://localhost:5173/invoices/inv-1'
};

describe('the local stand-in, through the SDK', () => {
	it('creates a checkout session and serves it back, shaped as the service answers', async () => {
		const db = tempDb();
		const { stripe } = await standIn(db);
		const made = await stripe.checkout.sessions.create(NEW_SESSION);
		expect(made.id).toMatch(/^cs_test_[0-9a-f]+$/);
		expect(made).toMatchObject({
			object: 'checkout.session',
			mode: 'payment',
			status: 'open',
			payment_status: 'unpaid',
			// Stripe API reference, Checkout Session: amount_total is the sum of the line items.
			amount_total: 123_450,
			currency: 'eur',
			metadata: { invoiceId: 'inv-1' },
			client_reference_id: 'inv-1',
			success_url: NEW_SESSION.success_url,
			cancel_url: NEW_SESSION.cancel_url,
			url: `http://localhost:5173/payments/test-checkout/${made.id}`
		});
		const again = await stripe.checkout.sessions.retrieve(made.id);
		expect(again).toEqual(made);
		const stored = db.select().from(fakeCheckoutSession).all();
		expect(stored.map((s) => [s.id, s.description])).toEqual([
			[made.id, 'Tern closed-return tunnel, invoice 7']
		]);
	});

	it('refuses what the app never sends with the service’s error shape', async () => {
		const db = tempDb();
		const { stripe } = await standIn(db);
		const refusal = (params: Stripe.Checkout.SessionCreateParams) =>
			stripe.checkout.sessions.create(params).then(
				() => null,
				(error: Stripe.errors.StripeError) => [
					error.type,
					error.statusCode,
					error.code,
					error.param
				]
			);
		expect(await refusal({ ...NEW_SESSION, mode: 'subscription' })).toEqual([
			'StripeInvalidRequestError',
			400,
			'parameter_invalid',
			'mode'
		]);
		const { success_url: _, ...noSuccess } = NEW_SESSION;
		expect(await refusal(noSuccess)).toEqual([
			'StripeInvalidRequestError',
			400,
			'parameter_missing',
			'success_url'
		]);
		expect(await refusal({ ...NEW_SESSION, customer_email: 'a@example.org' })).toEqual([
			'StripeInvalidRequestError',
			400,
			'parameter_unknown',
			'customer_email'
		]);
		const missing = await stripe.checkout.sessions.retrieve('cs_test_00').catch((e) => e);
		expect([missing.statusCode, missing.code]).toEqual([404, 'resource_missing']);
		expect(db.select().from(fakeCheckoutSession).all()).toEqual([]);
	});

	it('answers garbage, a wrong key and an oversized body without a server error', async () => {
		const db = tempDb();
		const { port } = await standIn(db);
		const wrongKey = new Stripe('sk_test_wrong', { host: '127.0.0.1', port, protocol: 'http' });
		const refused = await wrongKey.checkout.sessions.retrieve('cs_test_00').catch((e) => e);
		expect([refused.type, refused.statusCode]).toEqual(['StripeAuthenticationError', 401]);

		const post = (body: string, headers: Record<string, string> = {}) =>
			fetch(`http://127.0.0.1:${port}/v1/checkout/sessions`, {
				method: 'POST',
				headers: {
					authorization: `Bearer ${API_KEY}`,
					'content-type': 'application/x-www-form-urlencoded',
					...headers
				},
				body
			});
		for (const garbage of [
			'%%%&&&==',
			'line_items[0][price_data][unit_amount]=-5',
			'\u0000\uffff'
		]) {
			const answer = await post(garbage);
			expect(answer.status).toBe(400);
			expect((await answer.json()).error.type).toBe('invalid_request_error');
		}
		const huge = await post('metadata[x]=' + 'a'.repeat(70 * 1024));
		expect(huge.status).toBe(413);
		expect(db.select().from(fakeCheckoutSession).all()).toEqual([]);
	});
});
