import { and, desc, eq, sql } from 'drizzle-orm';
import type { Db, DbOrTx } from '../db/open';
import { mailOutbox } from '../db/schema';
import { refuse, type Outcome } from '../outcome';

export type OutgoingMail = { kind: string; to: string[]; subject: string; text: string };
export type OutboxEntry = typeof mailOutbox.$inferSelect;

/**
 * Queues a message; delivery happens later, outside the caller's transaction. Pass the
 * transaction that makes the change the message announces, so both commit or neither does.
 */
export function enqueueMail(db: DbOrTx, message: OutgoingMail): string {
	// Without recipients the relay refuses every attempt; better to stop the caller at once.
	if (message.to.length === 0) throw new Error(`Mail of kind "${message.kind}" has no recipient.`);
	return db
		.insert(mailOutbox)
		.values({ kind: message.kind, to: message.to, subject: message.subject, text: message.text })
		.returning({ id: mailOutbox.id })
		.get().id;
}

/** Newest first; rowid breaks ties between messages queued in the same millisecond. */
export function listOutbox(db: Db, { limit }: { limit: number }): OutboxEntry[] {
	return db
		.select()
		.from(mailOutbox)
		.orderBy(desc(mailOutbox.createdAt), desc(sql`rowid`))
		.limit(limit)
		.all();
}

/**
 * Puts a message that ran out of attempts back in the queue, due at once. Its attempts start
 * again from zero so it gets the full series of retries; the last error stays until the next try.
 */
export function retryMail(db: DbOrTx, id: string, now = Date.now()): Outcome {
	const changed = db
		.update(mailOutbox)
		.set({ state: 'pending', attempts: 0, nextAttemptAt: new Date(now) })
		.where(and(eq(mailOutbox.id, id), eq(mailOutbox.state, 'failed')))
		.run();
	if (changed.changes === 1) return { ok: true };
	const existing = db
		.select({ state: mailOutbox.state })
		.from(mailOutbox)
		.where(eq(mailOutbox.id, id))
		.get();
	return existing
		? refuse('conflict', `This message is ${existing.state}; only failed mail can be retried.`)
		: refuse('not-found', 'No such message.');
}
