import { afterEach } from 'vitest';
import type { FacilityRates } from '../../src/lib/calc';
import type { Db } from '../../src/lib/server/db/open';
import { invoice } from '../../src/lib/server/db/schema';
import { setPaymentService } from '../../src/lib/server/payments/running';
import { openPaymentService, type PaymentService } from '../../src/lib/server/payments/service';
import { approvedCampaignWorld } from './campaign-fixtures';

export const ORIGIN = 'http://localhost';

const opened: PaymentService[] = [];
afterEach(async () => {
	for (const service of opened.splice(0)) await service.close();
});

/** The local stand-in on its own loopback port, set as the app's service for route handlers. */
export async function standIn(db: Db): Promise<PaymentService> {
	const service = await openPaymentService(db, {}, () => {});
	opened.push(service);
	setPaymentService(service);
	return service;
}

// Rates as a facility would hold them; inputs only, never check values.
const RATES: FacilityRates = {
	hourlyRate: '780.00',
	setUpFee: '0.00',
	tearDownFee: '0.00',
	minimumCharge: '0.00',
	taxRate_percent: '0',
	currency: 'EUR'
};

let nextNumber = 1;

/**
 * An invoice row of the approved campaign, written straight into the table: the totals are
 * inputs of the payment side, which never prices anything itself.
 */
export function addInvoice(
	db: Db,
	w: ReturnType<typeof approvedCampaignWorld>,
	values: Partial<typeof invoice.$inferInsert> & { total: string; currency?: string }
): typeof invoice.$inferSelect {
	const { currency = 'EUR', ...rest } = values;
	return db
		.insert(invoice)
		.values({
			facilityId: w.tunnel,
			number: nextNumber++,
			kind: 'invoice',
			campaignId: w.campaignId,
			teamId: w.clientA,
			rates: { ...RATES, currency },
			occupied_s: 3600,
			lines: [],
			subtotal: values.total,
			tax: '0.00',
			...rest
		})
		.returning()
		.get();
}
