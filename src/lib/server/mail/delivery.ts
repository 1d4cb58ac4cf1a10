import { and, asc, eq, inArray, lte } from 'drizzle-orm';
import type { Db } from '../db/open';
import { mailOutbox } from '../db/schema';
import type { OutboxEntry } from './outbox';
import type { MailTransport } from './transport';

/** After this many failed tries a message stops and waits for an administrator. */
export const MAX_ATTEMPTS = 8;
const FIRST_RETRY_MS = 60_000;
const LONGEST_RETRY_MS = 3600_000;
/**
 * How long a claimed message stays hidden from other passes. Longer than one send can take
 * with the transport's timeouts; if the process dies mid-send the message comes back after it.
 */
const CLAIM_MS = 10 * 60_000;

/** 1 min, 2 min, 4 min … doubling after each failure, never more than an hour. */
function retryDelay_ms(attempts: number): number {
	return Math.min(FIRST_RETRY_MS * 2 ** (attempts - 1), LONGEST_RETRY_MS);
}

/**
 * Takes the next due message for this pass. The single UPDATE both finds and marks it (by
 * moving its next attempt past `now`), and SQLite runs it atomically, so two passes, even in
 * two processes on the same file, never take the same message.
 */
function claimNext(db: Db, now: number): OutboxEntry | undefined {
	const due = db
		.select({ id: mailOutbox.id })
		.from(mailOutbox)
		.where(and(eq(mailOutbox.state, 'pending'), lte(mailOutbox.nextAttemptAt, new Date(now))))
		.orderBy(asc(mailOutbox.nextAttemptAt))
		.limit(1);
	return db
		.update(mailOutbox)
		.set({ nextAttemptAt: new Date(now + CLAIM_MS) })
		.where(inArray(mailOutbox.id, due))
		.returning()
		.get();
}

function errorText(error: unknown): string {
	return error instanceof Error ? error.message : String(error);
}

/**
 * Sends every pending message due by `now`, one at a time. `failed` counts the sends that did
 * not go through in this pass, whether they will be retried or have now been given up.
 */
export async function deliverDue(
	db: Db,
	transport: MailTransport,
	now = Date.now()
): Promise<{ sent: number; failed: number }> {
	let sent = 0;
	let failed = 0;
	for (let message = claimNext(db, now); message; message = claimNext(db, now)) {
		const attempts = message.attempts + 1;
		try {
			await transport.sendMail({ to: message.to, subject: message.subject, text: message.text });
			db.update(mailOutbox)
				.set({ state: 'sent', attempts, sentAt: new Date(now), lastError: null })
				.where(eq(mailOutbox.id, message.id))
				.run();
			sent++;
		} catch (error) {
			db.update(mailOutbox)
				.set(
					attempts >= MAX_ATTEMPTS
						? { state: 'failed', attempts, lastError: errorText(error) }
						: {
								attempts,
								lastError: errorText(error),
								nextAttemptAt: new Date(now + retryDelay_ms(attempts))
							}
				)
				.where(eq(mailOutbox.id, message.id))
				.run();
			failed++;
		}
	}
	return { sent, failed };
}

/**
 * Runs a delivery pass every `interval_ms` until the returned function is called. The next pass
 * is scheduled when one ends, so a slow relay never stacks passes up.
 */
export function startMailDelivery(
	db: Db,
	transport: MailTransport,
	interval_ms = 2000
): () => void {
	let stopped = false;
	let timer: NodeJS.Timeout | undefined;
	const schedule = () => {
		// Unreferenced, so waiting mail never keeps the server process from shutting down.
		timer = setTimeout(pass, interval_ms).unref();
	};
	const pass = () => {
		void deliverDue(db, transport)
			.catch((error: unknown) => console.error('Mail delivery pass failed:', error))
			.finally(() => {
				if (!stopped) schedule();
			});
	};
	schedule();
	return () => {
		stopped = true;
		clearTimeout(timer);
	};
}
