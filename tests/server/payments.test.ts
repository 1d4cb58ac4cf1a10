import { eq } from 'drizzle-orm';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Db } from '../../src/lib/server/db/open';
import { auditEvent, invoice, mailOutbox, paymentEvent } from '../../src/lib/server/db/schema';
import { startCheckout } from '../../src/lib/server/payments/checkout';
import type { PaymentService } from '../../src/lib/server/payments/service';
import { POST as webhook } from '../../src/routes/api/v1/payments/webhook/+server';
import { approvedCampaignWorld } from './campaign-fixtures';
import { callRoute } from './call-route';
import { addInvoice, ORIGIN, standIn } from './payment-fixtures';
import { tempDb } from './temp-db';

afterEach(() => {
	vi.restoreAllMocks();
});

const URLS = { successUrl: `${ORIGIN}/invoices/x?paid=1`, cancelUrl: `${ORIGIN}/invoices/x` };

async function world() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const service = await standIn(db);
	return { db, w, service };
}

function stored(db: Db, id: string) {
	return db.select().from(invoice).where(eq(invoice.id, id)).get()!;
}

/** The event the service sends once a session is paid, as its raw body and signature header. */
async function paidEvent(
	service: PaymentService,
	sessionId: string,
	eventId = 'evt_test_paid_1',
	overrides: Record<string, unknown> = {}
) {
	const session = await service.stripe.checkout.sessions.retrieve(sessionId);
	const payload = JSON.stringify({
		id: eventId,
		object: 'event',
		type: 'checkout.session.completed',
		data: { object: { ...session, status: 'complete', payment_status: 'paid', ...overrides } }
	});
	const signature = service.stripe.webhooks.generateTestHeaderString({
		payload,
		secret: service.webhookSecret
	});
	return { payload, signature };
}

function deliver(db: Db, payload: string, signature: string | null) {
	return callRoute(webhook, db, null, {
		method: 'POST',
		raw: payload,
		headers: {
			'content-type': 'application/json',
			...(signature ? { 'stripe-signature': signature } : {})
		}
	});
}

const auditOf = (db: Db, campaignId: string) =>
	db
		.select()
		.from(auditEvent)
		.where(eq(auditEvent.campaignId, campaignId))
		.all()
		.filter((a) => a.action === 'receive-payment');
const paymentMail = (db: Db) =>
	db
		.select()
		.from(mailOutbox)
		.all()
		.filter((m) => m.kind === 'billing' && m.subject.includes(' paid'));

describe('starting a checkout', () => {
	it('opens one session for the invoice total in minor units and keeps its id', async () => {
		const { db, w, service } = await world();
		const bill = addInvoice(db, w, { total: '1234.50' });
		const started = await startCheckout(db, bill, URLS, service);
		if (!started.ok) throw new Error(started.message);
		const sessionId = stored(db, bill.id).checkoutSessionId!;
		expect(started.url).toBe(`${ORIGIN}/payments/test-checkout/${sessionId}`);
		const session = await service.stripe.checkout.sessions.retrieve(sessionId);
		expect(session).toMatchObject({
			mode: 'payment',
			// ISO 4217: the euro's minor unit is the cent, two digits.
			amount_total: 123_450,
			currency: 'eur',
			client_reference_id: bill.id,
			metadata: { invoiceId: bill.id },
			success_url: URLS.successUrl,
			cancel_url: URLS.cancelUrl
		});
		const again = await startCheckout(db, bill, URLS, service);
		expect(again).toEqual(started);
	});

	it('takes a currency without minor units as it is', async () => {
		const { db, w, service } = await world();
		const bill = addInvoice(db, w, { total: '98000', currency: 'JPY' });
		const started = await startCheckout(db, bill, URLS, service);
		expect(started.ok).toBe(true);
		const session = await service.stripe.checkout.sessions.retrieve(
			stored(db, bill.id).checkoutSessionId!
		);
		// ISO 4217: the yen has no minor unit (0 digits).
		expect([session.amount_total, session.currency]).toEqual([98_000, 'jpy']);
	});

	it('refuses a paid, credited, credit-note or zero invoice, and an unknown one', async () => {
		const { db, w, service } = await world();
		const credit = addInvoice(db, w, { total: '-100.00', kind: 'credit-note' });
		const cases = [
			addInvoice(db, w, { total: '100.00', paidAt: new Date() }),
			addInvoice(db, w, { total: '100.00', creditedBy: credit.id }),
			credit,
			addInvoice(db, w, { total: '0.00' })
		];
		for (const bill of cases) {
			const refused = await startCheckout(db, bill, URLS, service);
			expect(refused).toMatchObject({ ok: false, code: 'conflict' });
			expect(stored(db, bill.id).checkoutSessionId).toBeNull();
		}
		expect(await startCheckout(db, { id: 'nope' }, URLS, service)).toMatchObject({
			ok: false,
			code: 'not-found'
		});
	});

	it('passes on the service’s refusal of an amount it does not take', async () => {
		const { db, w, service } = await world();
		// The service takes amounts of up to eight digits in the minor unit (Stripe API reference, the
		// Charge object's `amount`: 99999999 is USD 999,999.99).
		const bill = addInvoice(db, w, { total: '1000000.00' });
		const refused = await startCheckout(db, bill, URLS, service);
		expect(refused).toMatchObject({ ok: false, code: 'invalid' });
		expect(stored(db, bill.id).checkoutSessionId).toBeNull();
	});

	it('refuses, rather than fails, when the service cannot be reached', async () => {
		const { db, w, service } = await world();
		const bill = addInvoice(db, w, { total: '100.00' });
		const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
		await service.close();
		const refused = await startCheckout(db, bill, URLS, service);
		expect(refused).toMatchObject({ ok: false, code: 'conflict' });
		expect(stored(db, bill.id).checkoutSessionId).toBeNull();
		expect(logged).toHaveBeenCalledOnce();
	});
});

describe('the webhook', () => {
	async function opened() {
		const { db, w, service } = await world();
		const bill = addInvoice(db, w, { total: '1234.50' });
		const started = await startCheckout(db, bill, URLS, service);
		if (!started.ok) throw new Error(started.message);
		return { db, w, service, bill, sessionId: stored(db, bill.id).checkoutSessionId! };
	}

	it('marks the invoice paid on a signed event, with an audit entry and a notice', async () => {
		const { db, w, service, bill, sessionId } = await opened();
		const { payload, signature } = await paidEvent(service, sessionId);
		const answer = await deliver(db, payload, signature);
		expect(answer).toMatchObject({ status: 200, body: { outcome: 'paid' } });
		const paid = stored(db, bill.id);
		expect(paid.paidAt).toBeInstanceOf(Date);
		expect(paid.paymentEventId).toBe('evt_test_paid_1');
		const [entry, ...more] = auditOf(db, w.campaignId);
		expect(more).toEqual([]);
		expect(entry).toMatchObject({
			actorId: null,
			fromState: 'approved',
			toState: 'approved'
		});
		const [mail, ...moreMail] = paymentMail(db);
		expect(moreMail).toEqual([]);
		expect(mail!.subject).toMatch(/^Invoice 0*\d+: [\d.]+ EUR paid — /);
		// The client team and the operators.
		expect(mail!.to.sort()).toEqual([w.aeroA.email, w.aeroA2.email, w.operator.email].sort());
	});

	it('refuses a bad or missing signature with 400 and changes nothing', async () => {
		const { db, w, service, bill, sessionId } = await opened();
		const warn = vi.spyOn(console, 'warn').mockImplementation(() => {});
		const { payload, signature } = await paidEvent(service, sessionId);
		const forged = service.stripe.webhooks.generateTestHeaderString({
			payload,
			secret: 'whsec_someone-else'
		});
		// Flip the signature's first hex digit to one it cannot already be.
		const flipped = signature.replace(
			/v1=(.)/,
			(_, digit: string) => `v1=${digit === '0' ? '1' : '0'}`
		);
		expect(flipped).not.toBe(signature);
		for (const header of [forged, null, 't=1,v1=00', flipped]) {
			const answer = await deliver(db, payload, header);
			expect(answer.status).toBe(400);
			expect(answer.body.error.code).toBe('bad-signature');
		}
		const tampered = payload.replace('"amount_total":123450', '"amount_total":1');
		expect((await deliver(db, tampered, signature)).status).toBe(400);
		expect(stored(db, bill.id).paidAt).toBeNull();
		expect(db.select().from(paymentEvent).all()).toEqual([]);
		expect(auditOf(db, w.campaignId)).toEqual([]);
		expect(paymentMail(db)).toEqual([]);
		expect(warn).toHaveBeenCalledTimes(5);
		for (const [line] of warn.mock.calls) expect(String(line)).not.toContain(sessionId);
	});

	it('answers a replayed event 200 and changes nothing', async () => {
		const { db, w, service, bill, sessionId } = await opened();
		const { payload, signature } = await paidEvent(service, sessionId);
		await deliver(db, payload, signature);
		const paidAt = stored(db, bill.id).paidAt;
		const replay = await deliver(db, payload, signature);
		expect(replay).toMatchObject({ status: 200, body: { outcome: 'duplicate' } });
		expect(stored(db, bill.id).paidAt).toEqual(paidAt);
		expect(auditOf(db, w.campaignId)).toHaveLength(1);
		expect(paymentMail(db)).toHaveLength(1);
	});

	it('leaves the invoice unpaid when the amount or currency differ from it', async () => {
		const { db, w, service, bill, sessionId } = await opened();
		const warn = vi.spyOn(console, 'warn').mockImplementation(() => {});
		const short = await paidEvent(service, sessionId, 'evt_test_short', { amount_total: 123_449 });
		const dollars = await paidEvent(service, sessionId, 'evt_test_usd', { currency: 'usd' });
		for (const { payload, signature } of [short, dollars]) {
			const answer = await deliver(db, payload, signature);
			expect(answer).toMatchObject({ status: 200, body: { outcome: 'not-applied' } });
		}
		expect(stored(db, bill.id).paidAt).toBeNull();
		expect(auditOf(db, w.campaignId)).toEqual([]);
		expect(paymentMail(db)).toEqual([]);
		expect(warn).toHaveBeenCalledTimes(2);
		expect(db.select({ id: paymentEvent.eventId }).from(paymentEvent).all()).toHaveLength(2);
	});

	it('records an event of another type or an unpaid session and changes nothing else', async () => {
		const { db, service, bill, sessionId } = await opened();
		const unpaid = await paidEvent(service, sessionId, 'evt_test_unpaid', {
			payment_status: 'unpaid'
		});
		expect((await deliver(db, unpaid.payload, unpaid.signature)).body.outcome).toBe('recorded');
		const payload = JSON.stringify({
			id: 'evt_test_expired',
			object: 'event',
			type: 'checkout.session.expired',
			data: { object: { id: sessionId, object: 'checkout.session' } }
		});
		const signature = service.stripe.webhooks.generateTestHeaderString({
			payload,
			secret: service.webhookSecret
		});
		expect((await deliver(db, payload, signature)).body.outcome).toBe('recorded');
		expect(stored(db, bill.id).paidAt).toBeNull();
		expect(
			db
				.select({ type: paymentEvent.type })
				.from(paymentEvent)
				.all()
				.map((e) => e.type)
				.sort()
		).toEqual(['checkout.session.completed', 'checkout.session.expired']);
	});
});
