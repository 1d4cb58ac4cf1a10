import type { DbOrTx } from '../db/open';
import type { campaign, invoice } from '../db/schema';
import { ownerAndOperators } from '../bookings/notices';
import { enqueueMail } from '../mail/outbox';

type Paid = {
	campaign: typeof campaign.$inferSelect;
	invoice: typeof invoice.$inferSelect;
	facilityName: string;
};

/** Tells the campaign's owner and every active operator that an invoice was paid. */
export function notifyPayment(
	tx: DbOrTx,
	{ campaign: c, invoice: paid, facilityName }: Paid,
	origin: string
) {
	const to = ownerAndOperators(tx, c.ownerId);
	if (!to.length) return;
	enqueueMail(tx, {
		kind: 'payment',
		to,
		subject: `Invoice ${paid.number} paid`,
		text:
			`Invoice ${paid.number} of ${facilityName}, ${paid.total} ${paid.rates.currency}, ` +
			`for the campaign "${c.name}" has been paid by card through the payment service.` +
			`\n\nCampaign: ${origin}/campaigns/${c.id}`
	});
}
