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

/** Where a person's browser pays a stand-in session: a page of the app itself. */
export const TEST_CHECKOUT_PATH = '/payments/test-checkout';

export function createFakeSession(db: DbOrTx, session: NewFakeSession): FakeSession {
	return db
		.insert(fakeCheckoutSession)
		.values({ ...session, id: `cs_test_${randomBytes(24).toString('hex')}` })
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
		metadata: session.metadata,
		client_reference_id: session.clientReferenceId,
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
