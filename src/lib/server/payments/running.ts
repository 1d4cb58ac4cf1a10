import type { PaymentService } from './service';

let running: PaymentService | undefined;

export function setPaymentService(service: PaymentService): void {
	running = service;
}

/** The app's payment service, opened by `startPayments` in hooks init. */
export function paymentService(): PaymentService {
	if (!running) throw new Error('Payments are not started: call startPayments in hooks init.');
	return running;
}
