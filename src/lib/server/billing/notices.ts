import { and, eq } from 'drizzle-orm';
import { addressOf, operatorAddresses } from '../bookings/notices';
import type { DbOrTx } from '../db/open';
import { teamMember, user, userRole } from '../db/schema';
import { enqueueMail } from '../mail/outbox';

/** The client team a bill goes to: the campaign's owner and its team's active aerodynamicists. */
function clientAddresses(tx: DbOrTx, c: { ownerId: string; teamId: string }): string[] {
	const team = tx
		.select({ email: user.email })
		.from(teamMember)
		.innerJoin(user, eq(user.id, teamMember.userId))
		.innerJoin(userRole, eq(userRole.userId, user.id))
		.where(
			and(
				eq(teamMember.teamId, c.teamId),
				eq(userRole.role, 'aerodynamicist'),
				eq(user.active, true)
			)
		)
		.all()
		.map((r) => r.email);
	return [addressOf(tx, c.ownerId), ...team].filter((e): e is string => !!e);
}

/**
 * A notice about a quote, invoice or payment, queued in the caller's transaction: to the client
 * team, to the operators, or both.
 */
export function notifyBilling(
	tx: DbOrTx,
	c: { ownerId: string; teamId: string },
	audience: { client: boolean; operators: boolean },
	subject: string,
	text: string,
	link: string
) {
	const to = new Set([
		...(audience.client ? clientAddresses(tx, c) : []),
		...(audience.operators ? operatorAddresses(tx) : [])
	]);
	if (to.size)
		enqueueMail(tx, { kind: 'billing', to: [...to], subject, text: `${text}\n\n${link}` });
}
