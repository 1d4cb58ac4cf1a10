import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../db/open';
import { user, userRole } from '../db/schema';
import { enqueueMail } from '../mail/outbox';

/** The addresses of a campaign's owner and every active operator, each once. */
export function ownerAndOperators(tx: DbOrTx, ownerId: string): string[] {
	const owner = tx.select({ email: user.email }).from(user).where(eq(user.id, ownerId)).get();
	const operators = tx
		.select({ email: user.email })
		.from(userRole)
		.innerJoin(user, eq(user.id, userRole.userId))
		.where(and(eq(userRole.role, 'operator'), eq(user.active, true)))
		.all()
		.map((r) => r.email);
	return [...new Set([owner?.email, ...operators].filter((e): e is string => !!e))];
}

/** Tells the campaign's owner and every active operator about a slot, in the same transaction. */
export function notifyBooking(
	tx: DbOrTx,
	c: { id: string; name: string; ownerId: string },
	subject: string,
	text: string,
	origin: string
) {
	const to = ownerAndOperators(tx, c.ownerId);
	if (to.length)
		enqueueMail(tx, {
			kind: 'booking',
			to,
			subject,
			text: `${text}\n\nCampaign: ${origin}/campaigns/${c.id}`
		});
}
