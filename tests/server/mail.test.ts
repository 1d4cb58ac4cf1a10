import { eq } from 'drizzle-orm';
import { createServer, type AddressInfo } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { caughtMail, mailOutbox } from '../../src/lib/server/db/schema';
import type { Db } from '../../src/lib/server/db/open';
import { deliverDue, MAX_ATTEMPTS, startMailDelivery } from '../../src/lib/server/mail/delivery';
import { listCaughtMail, startFakeSmtp } from '../../src/lib/server/mail/fake-smtp';
import { enqueueMail, listOutbox, retryMail } from '../../src/lib/server/mail/outbox';
import { createMailTransport } from '../../src/lib/server/mail/transport';
import { tempDb } from './temp-db';

const closing: (() => Promise<void>)[] = [];
afterEach(async () => {
	for (const close of closing.splice(0)) await close();
});

async function catcher(db: Db) {
	const smtp = await startFakeSmtp(db);
	closing.push(() => smtp.close());
	return createMailTransport({ localPort: smtp.port });
}

/** A loopback port that was free a moment ago and has nothing listening on it now. */
function closedPort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const probe = createServer();
		probe.once('error', reject);
		probe.listen(0, '127.0.0.1', () => {
			const { port } = probe.address() as AddressInfo;
			probe.close(() => resolve(port));
		});
	});
}

function row(db: Db, id: string) {
	const found = db.select().from(mailOutbox).where(eq(mailOutbox.id, id)).get();
	if (!found) throw new Error(`outbox row ${id} is missing`);
	return found;
}

const REPORT = {
	kind: 'review',
	to: ['lena.okafor@example.org', 'tomas.brandt@example.org'],
	subject: 'Campaign returned with notes',
	text: 'The reviewer asked for a finer yaw sweep near stall.\n\nOpen the campaign to see the notes.\n'
};
const INVITE = {
	kind: 'invitation',
	to: ['new.operator@example.org'],
	subject: 'Your invitation to Tunnelwright',
	text: 'Hello,\n\nChoose your password here:\n\nhttp://localhost/invitation/abc\n'
};

describe('delivery through the local catcher', () => {
	it('sends queued mail once and marks it sent', async () => {
		const db = tempDb();
		const transport = await catcher(db);
		const reportId = enqueueMail(db, REPORT);
		const inviteId = enqueueMail(db, INVITE);
		expect(listOutbox(db, { limit: 10 }).map((m) => [m.id, m.state])).toEqual([
			[inviteId, 'pending'],
			[reportId, 'pending']
		]);

		const now = Date.now() + 1000;
		expect(await deliverDue(db, transport, now)).toEqual({ sent: 2, failed: 0 });

		const caught = listCaughtMail(db, { limit: 10 });
		expect(caught).toHaveLength(2);
		for (const sent of [REPORT, INVITE]) {
			const found = caught.find((c) => c.subject === sent.subject);
			expect(found).toMatchObject({ from: '"Tunnelwright" <noreply@tunnelwright.invalid>' });
			expect(found).toMatchObject({ to: sent.to, text: sent.text });
		}
		for (const id of [reportId, inviteId]) {
			expect(row(db, id)).toMatchObject({ state: 'sent', attempts: 1, lastError: null });
			expect(row(db, id).sentAt?.getTime()).toBe(now);
		}

		expect(await deliverDue(db, transport, now + 3600_000)).toEqual({ sent: 0, failed: 0 });
		expect(db.select().from(caughtMail).all()).toHaveLength(2);
	});

	it('sends each message once when two passes overlap', async () => {
		const db = tempDb();
		const transport = await catcher(db);
		const subjects = ['Booking confirmed', 'Booking moved', 'Tunnel closed for maintenance'];
		for (const subject of subjects) enqueueMail(db, { ...REPORT, subject });

		const now = Date.now() + 1000;
		const [a, b] = await Promise.all([
			deliverDue(db, transport, now),
			deliverDue(db, transport, now)
		]);
		expect(a.sent + b.sent).toBe(3);
		expect(
			listCaughtMail(db, { limit: 10 })
				.map((c) => c.subject)
				.sort()
		).toEqual([...subjects].sort());
	});

	it('delivers on its own interval until stopped', async () => {
		const db = tempDb();
		const transport = await catcher(db);
		const stop = startMailDelivery(db, transport, 20);
		closing.push(async () => stop());
		const id = enqueueMail(db, INVITE);
		const deadline = Date.now() + 5000;
		while (row(db, id).state !== 'sent' && Date.now() < deadline) {
			await new Promise((r) => setTimeout(r, 20));
		}
		expect(row(db, id).state).toBe('sent');
		expect(listCaughtMail(db, { limit: 10 })).toHaveLength(1);
	});

	it('refuses mail without a recipient', () => {
		const db = tempDb();
		expect(() => enqueueMail(db, { ...INVITE, to: [] })).toThrow(/no recipient/);
		expect(listOutbox(db, { limit: 10 })).toEqual([]);
	});
});

describe('when the relay cannot be reached', () => {
	it('backs off, gives up after the last attempt, and can be retried', async () => {
		const db = tempDb();
		const unreachable = createMailTransport({ localPort: await closedPort() });
		const id = enqueueMail(db, INVITE);
		let now = row(db, id).nextAttemptAt.getTime();

		// 1 min doubling, capped at 1 h: the schedule delivery.ts promises.
		const pauses_s = [60, 120, 240, 480, 960, 1920, 3600];
		expect(MAX_ATTEMPTS).toBe(pauses_s.length + 1);
		for (const [i, pause_s] of pauses_s.entries()) {
			expect(await deliverDue(db, unreachable, now)).toEqual({ sent: 0, failed: 1 });
			const after = row(db, id);
			expect(after).toMatchObject({ state: 'pending', attempts: i + 1 });
			expect(after.lastError).toMatch(/ECONNREFUSED/);
			expect(after.nextAttemptAt.getTime()).toBe(now + pause_s * 1000);

			expect(await deliverDue(db, unreachable, now + pause_s * 1000 - 1)).toEqual({
				sent: 0,
				failed: 0
			});
			now += pause_s * 1000;
		}
		expect(await deliverDue(db, unreachable, now)).toEqual({ sent: 0, failed: 1 });
		expect(row(db, id)).toMatchObject({ state: 'failed', attempts: MAX_ATTEMPTS });
		expect(await deliverDue(db, unreachable, now + 30 * 24 * 3600_000)).toEqual({
			sent: 0,
			failed: 0
		});

		const later = now + 86_400_000;
		expect(retryMail(db, id, later)).toEqual({ ok: true });
		const retried = row(db, id);
		expect(retried).toMatchObject({ state: 'pending', attempts: 0 });
		expect(retried.nextAttemptAt.getTime()).toBe(later);
		expect(retryMail(db, id, later)).toMatchObject({ ok: false, code: 'conflict' });
		expect(retryMail(db, 'no-such-message')).toMatchObject({ ok: false, code: 'not-found' });

		const transport = await catcher(db);
		expect(await deliverDue(db, transport, later)).toEqual({ sent: 1, failed: 0 });
		expect(row(db, id)).toMatchObject({ state: 'sent', attempts: 1, lastError: null });
		expect(listCaughtMail(db, { limit: 10 })).toMatchObject([{ to: INVITE.to }]);
	});
});
