import { env } from '$env/dynamic/private';
import type { Db } from '../db/open';
import { setPaymentService } from './running';
import { openPaymentService } from './service';

export { paymentService } from './running';
export type { PaymentService } from './service';
export { startCheckout, type CheckoutUrls } from './checkout';
export { receiveWebhook, type WebhookAnswer } from './webhook';
export {
	payTestCheckout,
	testCheckoutCancelUrl,
	testCheckoutView,
	type TestCheckoutView
} from './test-checkout';

let starting: Promise<void> | undefined;

async function start(db: Db): Promise<void> {
	const service = await openPaymentService(db, env);
	// The SDK's open connections and the local stand-in would keep the process alive after
	// adapter-node has closed its server.
	process.once('sveltekit:shutdown', () => void service.close());
	setPaymentService(service);
}

/**
 * Opens the payment service: the account of `STRIPE_SECRET_KEY` or, without one, the local
 * stand-in. Called once at server start-up; later calls wait for the first.
 */
export async function startPayments(db: Db): Promise<void> {
	starting ??= start(db);
	await starting;
}
