import { env } from '$env/dynamic/private';
import type { Db } from '../db/open';
import { deliverDue, startMailDelivery } from './delivery';
import { startFakeSmtp } from './fake-smtp';
import { createMailTransport, DEFAULT_MAIL_FROM, type MailTransport } from './transport';

export { enqueueMail, listOutbox, retryMail, type OutboxEntry } from './outbox';
export { listCaughtMail, type CaughtMessage } from './fake-smtp';
export { MAX_ATTEMPTS } from './delivery';
export { accountLink, mailAccountLink } from './account-links';

type Running = { transport: MailTransport; catching: boolean };

let starting: Promise<Running> | undefined;
let running: Running | undefined;

async function start(db: Db): Promise<Running> {
	const from = env.MAIL_FROM?.trim() || DEFAULT_MAIL_FROM;
	const smtpUrl = env.SMTP_URL?.trim();
	let transport: MailTransport;
	if (smtpUrl) {
		transport = createMailTransport({ url: smtpUrl }, from);
	} else {
		const catcher = await startFakeSmtp(db);
		console.log(
			`Mail: SMTP_URL is not set; outgoing mail is caught on 127.0.0.1:${catcher.port} and shown on /admin/outbox.`
		);
		transport = createMailTransport({ localPort: catcher.port }, from);
	}
	startMailDelivery(db, transport);
	running = { transport, catching: !smtpUrl };
	return running;
}

/**
 * Starts delivering the outbox, through SMTP_URL's relay or, without one, into the local
 * catcher. Called once at server start-up; later calls wait for the first.
 */
export async function startMail(db: Db): Promise<void> {
	starting ??= start(db);
	await starting;
}

function started(): Running {
	if (!running) throw new Error('Mail delivery is not running: call startMail in hooks init.');
	return running;
}

/** One delivery pass now, beside the regular ones; their claims keep a message from going twice. */
export function deliverNow(db: Db): Promise<{ sent: number; failed: number }> {
	return deliverDue(db, started().transport);
}

/** True when mail goes to the local catcher rather than a real relay. */
export function catchingMail(): boolean {
	return started().catching;
}
