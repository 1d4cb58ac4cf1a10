import { and, eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import type Stripe from 'stripe';
import type { DbOrTx } from '../db/open';
import { fakeCheckoutSession } from '../db/schema';

export type FakeSession = typeof fakeCheckoutSession.$inferSelect;

export type NewFakeSession = {
	amount_minor: number;
	currency: string;
	description: string;
	metadata: Record<string, string>;
	clientReferenceId: string | null;
	successUrl: string;
	cancelUrl: string;
};

/**
 * The stand-in keeps `client_reference_id` inside the stored metadata under a key the service
 * never allows in metadata (square brackets), so the two cannot collide.
 */
const CLIENT_REFERENCE_KEY = '[client_reference_id]';

/** Where a person's browser pays a stand-in session: a page of the app itself. */
export const TEST_CHECKOUT_PATH = '/payments/test-checkout';

export function createFakeSession(db: DbOrTx, session: NewFakeSession): FakeSession {
	const { clientReferenceId, metadata, ...rest } = session;
	return db
		.insert(fakeCheckoutSession)
		.values({
			...rest,
			id: `cs_test_${randomBytes(24).toString('hex')}`,
			metadata: clientReferenceId
				? { ...metadata, [CLIENT_REFERENCE_KEY]: clientReferenceId }
				: metadata
		})
		.returning()
		.get();
}

export function findFakeSession(db: DbOrTx, id: string): FakeSession | undefined {
	return db.select().from(fakeCheckoutSession).where(eq(fakeCheckoutSession.id, id)).get();
}

/** Marks an open session paid; false when it had already ended, so it is paid at most once. */
export function completeFakeSession(db: DbOrTx, id: string): boolean {
	const changed = db
		.update(fakeCheckoutSession)
		.set({ status: 'complete', paymentStatus: 'paid' })
		.where(and(eq(fakeCheckoutSession.id, id), eq(fakeCheckoutSession.status, 'open')))
		.run();
	return changed.changes === 1;
}

/**
 * The session as the service's API answers it: the fields the app reads, the rest of the
 * object's shape filled with what a payment-mode session without a customer carries.
 */
export function sessionObject(session: FakeSession): Stripe.Checkout.Session {
	const { [CLIENT_REFERENCE_KEY]: clientReferenceId, ...metadata } = session.metadata;
	const open = session.status === 'open';
	const shape = {
		id: session.id,
		object: 'checkout.session',
		livemode: false,
		mode: 'payment',
		created: Math.floor(session.createdAt.getTime() / 1000),
		amount_subtotal: session.amount_minor,
		amount_total: session.amount_minor,
		currency: session.currency,
		metadata,
		client_reference_id: clientReferenceId ?? null,
		success_url: session.successUrl,
		cancel_url: session.cancelUrl,
		status: session.status,
		payment_status: session.paymentStatus,
		// The service gives the page's address only while the session can still be paid.
		url: open ? new URL(`${TEST_CHECKOUT_PATH}/${session.id}`, session.successUrl).href : null,
		customer: null,
		customer_details: null,
		payment_intent: null
	};
	// Only these fields exist in the stand-in; the SDK's type lists every field of the service.
	return shape as unknown as Stripe.Checkout.Session;
}
