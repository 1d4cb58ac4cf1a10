import { eq } from 'drizzle-orm';
import { toMinorUnits } from '../../calc';
import { writeTransaction, type Db, type Tx } from '../db/open';
import { documentNumber } from '../../billing/numbers';
import { notifyBilling } from '../billing/notices';
import { campaign, facility, invoice, paymentEvent } from '../db/schema';
import { recordCampaignEvent } from '../review/audit';

/** What became of one event from the payment service. */
export type Receipt =
	| 'paid'
	/** Seen before: the service sends an event again until it hears 200, and anyone may replay one. */
	| 'duplicate'
	/** Kept for its id only: a type the app does not act on, or a session not yet paid. */
	| 'recorded'
	/** Kept, and the invoice left as it was: logged for someone to look at. */
	| 'not-applied';

/** The parts of a paid checkout session the app acts on. */
export type PaidSession = {
	sessionId: string;
	invoiceId: string | null;
	amount_minor: number | null;
	currency: string | null;
};

/** Who the audit trail names for a payment: no person of the app made it. */
const PAYMENT_SERVICE_ACTOR = 'Payment service';

function applyPayment(tx: Tx, eventId: string, paid: PaidSession, origin: string): Receipt {
	const warn = (why: string) => {
		console.warn(`Payment event ${eventId} (session ${paid.sessionId}) not applied: ${why}.`);
		return 'not-applied' as const;
	};
	if (!paid.invoiceId) return warn('it names no invoice');
	const row = tx
		.select({ invoice, facilityName: facility.name, campaign })
		.from(invoice)
		.innerJoin(facility, eq(facility.id, invoice.facilityId))
		.innerJoin(campaign, eq(campaign.id, invoice.campaignId))
		.where(eq(invoice.id, paid.invoiceId))
		.get();
	if (!row) return warn(`no invoice ${paid.invoiceId}`);
	const { invoice: billed, campaign: c } = row;
	const currency = billed.rates.currency;
	if (billed.kind !== 'invoice') return warn(`${billed.id} is a credit note`);
	if (billed.paidAt)
		return warn(`invoice ${billed.id} was already paid; refund this payment by hand`);
	if (
		paid.amount_minor !== toMinorUnits(billed.total, currency) ||
		paid.currency !== currency.toLowerCase()
	)
		return warn(
			`${paid.amount_minor} ${paid.currency} paid, invoice ${billed.id} is for ${billed.total} ${currency}`
		);

	if (billed.creditedBy)
		console.warn(`Invoice ${billed.id} was paid after a credit note cancelled it; refund by hand.`);
	tx.update(invoice)
		.set({ paidAt: new Date(), paymentEventId: eventId })
		.where(eq(invoice.id, billed.id))
		.run();
	const said = `Invoice ${documentNumber(billed.number)}: ${billed.total} ${currency} paid`;
	recordCampaignEvent(
		tx,
		c,
		{ id: null, name: PAYMENT_SERVICE_ACTOR },
		'receive-payment',
		`${said} by card.`
	);
	notifyBilling(
		tx,
		c,
		{ client: true, operators: true },
		`${said} — ${c.name}`,
		`${said} by card through the payment service, for “${c.name}” at ${row.facilityName}.`,
		`${origin}/invoices/${billed.id}`
	);
	return 'paid';
}

/**
 * Files one verified event in one transaction: its id first, so a replay changes nothing, then
 * for a paid session the invoice it names, when the amount and currency are the invoice's.
 */
export function receivePaymentEvent(
	db: Db,
	event: { id: string; type: string },
	paid: PaidSession | null,
	origin: string
): Receipt {
	return writeTransaction(db, (tx) => {
		const fresh = tx
			.insert(paymentEvent)
			.values({ eventId: event.id, type: event.type, invoiceId: paid?.invoiceId ?? null })
			.onConflictDoNothing()
			.run();
		if (fresh.changes === 0) return 'duplicate';
		return paid ? applyPayment(tx, event.id, paid, origin) : 'recorded';
	});
}
