import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { documentNumber } from '../../billing/numbers';
import { toMinorUnits } from '../../calc';
import type { Db } from '../db/open';
import { facility, invoice } from '../db/schema';
import { refuse, type Outcome } from '../outcome';
import { paymentService } from './running';
import type { PaymentService } from './service';

export type CheckoutUrls = {
	/** Where the service sends the payer after paying; the invoice is marked paid by the webhook. */
	successUrl: string;
	cancelUrl: string;
};

type InvoiceRow = typeof invoice.$inferSelect;

/** Why an invoice cannot be paid now, or null when it can. */
function unpayable(row: InvoiceRow): string | null {
	if (row.kind !== 'invoice') return 'A credit note is not paid.';
	if (row.paidAt) return 'This invoice is already paid.';
	if (row.creditedBy) return 'This invoice was cancelled by a credit note.';
	if (toMinorUnits(row.total, row.rates.currency) <= 0)
		return 'This invoice comes to nothing to pay.';
	return null;
}

/**
 * The service said no or could not be reached. A refused request (an amount under the
 * service's minimum, a currency the account does not take) is the payer's to read; anything
 * else is the operator's, and the payer is asked to try later.
 */
function serviceRefusal(error: InstanceType<typeof Stripe.errors.StripeError>) {
	if (error instanceof Stripe.errors.StripeInvalidRequestError)
		return refuse('invalid', `The payment service refused this payment: ${error.message}`);
	console.error(`Payment service: ${error.type} ${error.statusCode ?? ''} ${error.message}`);
	return refuse('conflict', 'The payment service cannot be reached just now; try again later.');
}

/** The line the payer sees on the service's page and statement. */
export function checkoutDescription(facilityName: string, number: number): string {
	return `${facilityName}, invoice ${documentNumber(number)}`;
}

/** An open session already made for this invoice, for the same amount, to send the payer back to. */
async function openSessionUrl(
	service: PaymentService,
	row: InvoiceRow,
	amount_minor: number
): Promise<string | null> {
	if (!row.checkoutSessionId) return null;
	try {
		const session = await service.stripe.checkout.sessions.retrieve(row.checkoutSessionId);
		const same =
			session.status === 'open' &&
			session.amount_total === amount_minor &&
			session.currency === row.rates.currency.toLowerCase();
		return same ? session.url : null;
	} catch {
		// A session the service no longer knows (made against another account, say): start anew.
		return null;
	}
}

/**
 * Starts paying an invoice on the payment service's hosted page and answers its address. The
 * caller has already checked that the signed-in user may pay it. An open session made earlier
 * is reused, so two clicks cannot take the money twice; the invoice is marked paid only when
 * the service's signed webhook says so.
 */
export async function startCheckout(
	db: Db,
	target: { id: string },
	{ successUrl, cancelUrl }: CheckoutUrls,
	service: PaymentService = paymentService()
): Promise<Outcome<{ url: string }>> {
	const found = db
		.select({ row: invoice, facilityName: facility.name })
		.from(invoice)
		.innerJoin(facility, eq(facility.id, invoice.facilityId))
		.where(eq(invoice.id, target.id))
		.get();
	if (!found) return refuse('not-found', 'No such invoice.');
	const { row, facilityName } = found;
	const why = unpayable(row);
	if (why) return refuse('conflict', why);

	const amount_minor = toMinorUnits(row.total, row.rates.currency);
	const reused = await openSessionUrl(service, row, amount_minor);
	if (reused) return { ok: true, url: reused };

	let session: Stripe.Checkout.Session;
	try {
		session = await service.stripe.checkout.sessions.create({
			mode: 'payment',
			line_items: [
				{
					quantity: 1,
					price_data: {
						currency: row.rates.currency.toLowerCase(),
						unit_amount: amount_minor,
						product_data: { name: checkoutDescription(facilityName, row.number) }
					}
				}
			],
			client_reference_id: row.id,
			metadata: { invoiceId: row.id },
			success_url: successUrl,
			cancel_url: cancelUrl
		});
	} catch (error) {
		if (!(error instanceof Stripe.errors.StripeError)) throw error;
		return serviceRefusal(error);
	}
	if (!session.url) throw new Error(`Checkout session ${session.id} came without a page address.`);
	db.update(invoice).set({ checkoutSessionId: session.id }).where(eq(invoice.id, row.id)).run();
	return { ok: true, url: session.url };
}
