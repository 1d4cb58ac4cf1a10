import type { DbOrTx } from '../db/open';
import { INVITATION_LIFETIME_DAYS } from '../users';
import { enqueueMail } from './outbox';

export type AccountLinkPurpose = 'invitation' | 'new-invitation' | 'password-reset';

/** Where a one-time token is redeemed: the set-password page. */
export function accountLink(origin: string, token: string): string {
	return `${origin}/invitation/${token}`;
}

const lifetime = `The link works once, and for ${INVITATION_LIFETIME_DAYS} days.`;
const welcome = (sender: string) =>
	`${sender} has given you an account on Tunnelwright, where wind-tunnel campaigns are planned, reviewed and booked. To start, choose your password here:`;

/** What each one-time link mail says around the link. */
const ACCOUNT_LINK_MAILS: Record<
	AccountLinkPurpose,
	{ subject: string; before: (sender: string) => string; after: string }
> = {
	invitation: {
		subject: 'Your invitation to Tunnelwright',
		before: welcome,
		after: `${lifetime} If you were not expecting this, ignore this message and the account stays unused.`
	},
	'new-invitation': {
		subject: 'Your invitation to Tunnelwright',
		before: welcome,
		after: `${lifetime} Links sent to you before no longer work.`
	},
	'password-reset': {
		subject: 'Choose a new Tunnelwright password',
		before: (sender) => `${sender} has sent you a link to choose a new Tunnelwright password:`,
		after: `${lifetime} Links sent to you before no longer work, and your current password stays valid until you use this one.`
	}
};

/**
 * Queues the mail that carries a one-time link. Safe to queue after the account change has
 * committed: the link is shown to the administrator as well, so a lost message never loses it.
 */
export function mailAccountLink(
	db: DbOrTx,
	purpose: AccountLinkPurpose,
	to: { name: string; email: string },
	sender: string,
	link: string
): void {
	const { subject, before, after } = ACCOUNT_LINK_MAILS[purpose];
	enqueueMail(db, {
		kind: 'invitation',
		to: [to.email],
		subject,
		text: `Hello ${to.name},\n\n${before(sender)}\n\n${link}\n\n${after}\n`
	});
}
