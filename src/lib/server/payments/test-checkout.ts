import Decimal from 'decimal.js';
import { eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { minorDigits } from '../../calc';
import type { Db } from '../db/open';
import { fakeCheckoutSession } from '../db/schema';
import { refuse, type Outcome } from '../outcome';
import { completeFakeSession, findFakeSession, sessionObject } from './fake-sessions';
import type { PaymentService } from './service';

export type TestCheckoutView = {
	id: string;
	description: string;
	/** In the currency's major unit, with its minor digits: `1234.50`. */
	amount: string;
	currency: string;
	open: boolean;
};

/** The stand-in's session for its page; undefined when the real service is in use or none is found. */
export function testCheckoutView(
	db: Db,
	service: PaymentService,
	id: string
): TestCheckoutView | undefined {
	if (!service.testCheckout) return undefined;
	const session = findFakeSession(db, id);
	if (!session) return undefined;
	const currency = session.currency.toUpperCase();
	const digits = minorDigits(currency);
	return {
		id: session.id,
		description: session.description,
		amount: new Decimal(session.amount_minor).div(new Decimal(10).pow(digits)).toFixed(digits),
		currency,
		open: session.status === 'open'
	};
}

/** Where Cancel sends the payer back to; undefined as for the page. */
export function testCheckoutCancelUrl(
	db: Db,
	service: PaymentService,
	id: string
): string | undefined {
	return service.testCheckout ? findFakeSession(db, id)?.cancelUrl : undefined;
}

/**
 * Pays a stand-in session as the service does once a card is accepted: the session becomes
 * complete and paid, and the signed `checkout.session.completed` event goes to the app's own
 * webhook over HTTP, the same way the service's would. Answers the session's success address.
 */
export async function payTestCheckout(
	db: Db,
	service: PaymentService,
	id: string,
	webhookUrl: string
): Promise<Outcome<{ successUrl: string }>> {
	if (!service.testCheckout) return refuse('not-found', 'No such checkout.');
	if (!findFakeSession(db, id)) return refuse('not-found', 'No such checkout.');
	if (!completeFakeSession(db, id)) return refuse('conflict', 'This checkout has already ended.');
	const session = findFakeSession(db, id)!;
	const payload = JSON.stringify({
		id: `evt_test_${randomBytes(16).toString('hex')}`,
		object: 'event',
		created: Math.floor(Date.now() / 1000),
		livemode: false,
		pending_webhooks: 1,
		type: 'checkout.session.completed',
		data: { object: sessionObject(session) }
	});
	const signature = service.stripe.webhooks.generateTestHeaderString({
		payload,
		secret: service.webhookSecret
	});
	const delivered = await fetch(webhookUrl, {
		method: 'POST',
		headers: { 'content-type': 'application/json', 'stripe-signature': signature },
		body: payload,
		signal: AbortSignal.timeout(10_000)
	}).then(
		(response) => response.ok,
		() => false
	);
	if (!delivered) {
		// The service would retry; the stand-in lets the payer try again instead.
		db.update(fakeCheckoutSession)
			.set({ status: 'open', paymentStatus: 'unpaid' })
			.where(eq(fakeCheckoutSession.id, id))
			.run();
		return refuse('conflict', 'The app did not accept the payment notice; try again.');
	}
	return { ok: true, successUrl: session.successUrl };
}
