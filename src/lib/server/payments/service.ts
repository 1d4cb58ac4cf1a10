import Stripe from 'stripe';
import type { Db } from '../db/open';
import { storedSecret } from '../settings';
import { startFakePaymentService } from './fake-service';

export type PaymentService = {
	stripe: Stripe;
	/** The secret the service signs its webhook calls with. */
	webhookSecret: string;
	/** True when the local stand-in answers instead of the real service. */
	testCheckout: boolean;
	close(): Promise<void>;
};

type Env = Record<string, string | undefined>;

/**
 * The payment service the app talks to, always through the SDK: the account of
 * `STRIPE_SECRET_KEY` or, without one, the local stand-in on a loopback port, reached by
 * pointing the same client at it. The stand-in's key and signing secret are kept in the
 * database, so every app process on it signs and checks alike.
 */
export async function openPaymentService(
	db: Db,
	env: Env,
	log: (line: string) => void = console.log
): Promise<PaymentService> {
	const secretKey = env.STRIPE_SECRET_KEY?.trim();
	if (secretKey) {
		const webhookSecret = env.STRIPE_WEBHOOK_SECRET?.trim();
		// Without it no payment could ever be confirmed: better to stop the start than every payment.
		if (!webhookSecret)
			throw new Error(
				'STRIPE_SECRET_KEY is set but STRIPE_WEBHOOK_SECRET is not (README, Payments).'
			);
		return {
			stripe: new Stripe(secretKey),
			webhookSecret,
			testCheckout: false,
			close: async () => undefined
		};
	}
	const apiKey = `sk_test_${storedSecret(db, 'payments-stand-in-api-key')}`;
	const fake = await startFakePaymentService(db, apiKey);
	log(
		`Payments: STRIPE_SECRET_KEY is not set; checkout goes to a local stand-in on 127.0.0.1:${fake.port} that takes no card.`
	);
	return {
		stripe: new Stripe(apiKey, { host: '127.0.0.1', port: fake.port, protocol: 'http' }),
		webhookSecret: `whsec_${storedSecret(db, 'payments-stand-in-webhook-secret')}`,
		testCheckout: true,
		close: () => fake.close()
	};
}
