import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../db/open';
import { user, userRole } from '../db/schema';
import { enqueueMail } from '../mail/outbox';

/** Addresses of every active operator: the people who keep a facility's calendar and bills. */
export function operatorAddresses(tx: DbOrTx): string[] {
	return tx
		.select({ email: user.email })
		.from(userRole)
		.innerJoin(user, eq(user.id, userRole.userId))
		.where(and(eq(userRole.role, 'operator'), eq(user.active, true)))
		.all()
		.map((r) => r.email);
}

export function addressOf(tx: DbOrTx, userId: string): string | undefined {
	return tx.select({ email: user.email }).from(user).where(eq(user.id, userId)).get()?.email;
}

/** Tells the campaign's owner and every active operator about a slot, in the same transaction. */
export function notifyBooking(
	tx: DbOrTx,
	c: { id: string; name: string; ownerId: string },
	subject: string,
	text: string,
	origin: string
) {
	const to = [...new Set([addressOf(tx, c.ownerId), ...operatorAddresses(tx)])].filter(
		(e): e is string => !!e
	);
	if (to.length)
		enqueueMail(tx, {
			kind: 'booking',
			to,
			subject,
			text: `${text}\n\nCampaign: ${origin}/campaigns/${c.id}`
		});
}
