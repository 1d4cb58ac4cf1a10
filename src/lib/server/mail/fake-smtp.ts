import { desc, sql } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import type { Readable } from 'node:stream';
import { SMTPServer, type SMTPServerSession } from 'smtp-server';
import type { Db } from '../db/open';
import { caughtMail } from '../db/schema';

export type FakeSmtp = { port: number; close(): Promise<void> };
export type CaughtMessage = typeof caughtMail.$inferSelect;

async function keep(db: Db, stream: Readable, session: SMTPServerSession): Promise<void> {
	const parsed = await simpleParser(stream);
	const { mailFrom, rcptTo } = session.envelope;
	db.insert(caughtMail)
		.values({
			from: parsed.from?.text ?? (mailFrom ? mailFrom.address : ''),
			// The envelope, not the To header, names everyone the message would have reached.
			to: rcptTo.map((r) => r.address),
			subject: parsed.subject ?? '',
			text: parsed.text ?? ''
		})
		.run();
}

/**
 * A mail catcher for demos and tests: an SMTP server on loopback that accepts any message,
 * without sign-in or TLS, and keeps it in `caughtMail` instead of passing it on.
 */
export function startFakeSmtp(db: Db): Promise<FakeSmtp> {
	const server = new SMTPServer({
		secure: false,
		disabledCommands: ['STARTTLS'],
		authOptional: true,
		disableReverseLookup: true,
		onData(stream, session, callback) {
			// Answering only after the row is written means a sender that was told "accepted"
			// will find the message in the catcher.
			keep(db, stream, session).then(
				() => callback(),
				(error: Error) => callback(error)
			);
		}
	});
	server.on('error', (error) => console.error('Local mail catcher:', error));
	return new Promise((resolve, reject) => {
		server.server.once('error', reject);
		server.listen(0, '127.0.0.1', () => {
			server.server.off('error', reject);
			// adapter-node exits once its own server has closed; the catcher must not hold it open.
			server.server.unref();
			const { port } = server.server.address() as AddressInfo;
			resolve({ port, close: () => new Promise((done) => server.close(done)) });
		});
	});
}

/** Newest first; rowid breaks ties between messages caught in the same millisecond. */
export function listCaughtMail(db: Db, { limit }: { limit: number }): CaughtMessage[] {
	return db
		.select()
		.from(caughtMail)
		.orderBy(desc(caughtMail.receivedAt), desc(sql`rowid`))
		.limit(limit)
		.all();
}
