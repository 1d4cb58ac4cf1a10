import Stripe from 'stripe';
import type { Db } from '../db/open';
import { receivePaymentEvent, type PaidSession, type Receipt } from './receive-payment';
import type { PaymentService } from './service';

export type WebhookAnswer =
	| { ok: true; receipt: Receipt }
	| { ok: false; code: 'bad-signature' | 'invalid-event'; message: string };

/** The events that can pay an invoice; a card payment arrives paid with the first. */
const PAYING_EVENTS = new Set([
	'checkout.session.completed',
	'checkout.session.async_payment_succeeded'
]);

function paidSession(event: Stripe.Event): PaidSession | null {
	if (!PAYING_EVENTS.has(event.type)) return null;
	const session = event.data.object as Stripe.Checkout.Session;
	if (session.payment_status !== 'paid' || typeof session.id !== 'string') return null;
	return {
		sessionId: session.id,
		invoiceId: session.metadata?.invoiceId ?? session.client_reference_id ?? null,
		amount_minor: session.amount_total,
		currency: session.currency
	};
}

/** A verified body is the service's, yet its shape is checked before the database sees it. */
function isEvent(event: unknown): event is Stripe.Event {
	if (!event || typeof event !== 'object') return false;
	const { id, type, data } = event as Record<string, unknown>;
	const object = (data as Record<string, unknown> | null | undefined)?.object;
	return (
		typeof id === 'string' &&
		id.length <= 255 &&
		typeof type === 'string' &&
		type.length <= 255 &&
		!!object &&
		typeof object === 'object'
	);
}

function notAnEvent(): WebhookAnswer {
	console.warn('Payment webhook refused: a signed body that is not an event.');
	return { ok: false, code: 'invalid-event', message: 'The body is not an event.' };
}

/**
 * Handles one call of the payment service's webhook: the raw body is checked against the
 * signature header with the shared secret before anything in it is believed. Only the event's
 * id, type and the session's amount and invoice are read; nothing about the card is kept.
 */
export function receiveWebhook(
	db: Db,
	service: PaymentService,
	rawBody: string | Uint8Array,
	signature: string | null,
	origin: string
): WebhookAnswer {
	let event: Stripe.Event;
	try {
		event = service.stripe.webhooks.constructEvent(rawBody, signature ?? '', service.webhookSecret);
	} catch (error) {
		if (!(error instanceof Stripe.errors.StripeSignatureVerificationError)) return notAnEvent();
		// The SDK's first line says what failed (no header, no match, too old) and quotes nothing.
		console.warn(`Payment webhook refused: ${error.message.split('\n')[0]!.slice(0, 120)}`);
		return {
			ok: false,
			code: 'bad-signature',
			message: 'The Stripe-Signature header does not verify this body.'
		};
	}
	if (!isEvent(event)) return notAnEvent();
	return { ok: true, receipt: receivePaymentEvent(db, event, paidSession(event), origin) };
}
