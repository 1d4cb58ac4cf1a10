/**
 * The records the fuzz points its requests at, found through the API of its own app instance
 * at the start; the few no API lists are read from the database.
 */
import Database from 'better-sqlite3';
import type { Actor, Sessions } from './fuzz-app';
import { addTestCheckoutSession } from './test-checkout-session';

export type Fixture = {
	draftCampaign: string;
	/** A draft made for the fuzz, so the delete routes have one of their own. */
	spareDraft: string;
	inReviewCampaign: string;
	inReviewRevision: number;
	approvedCampaign: string;
	readingsSample: string;
	facility: string;
	facilityBody: Record<string, unknown>;
	campaignBody: Record<string, unknown>;
	model: string;
	modelBody: Record<string, unknown>;
	booking: string;
	token: string;
	feedToken: string;
	invitationToken: string;
	/** Read from the database: no API lists them. */
	otherUser: string;
	upload: string;
	mail: string;
	team: string;
	quote: string;
	invoice: string;
	/** A session of the local payment stand-in, written into the database. */
	checkoutSession: string;
};

type Get = (actor: Actor, path: string, init?: RequestInit) => Promise<Response>;

function client(baseUrl: string, sessions: Sessions): Get {
	return (actor, path, init = {}) =>
		fetch(new URL(path, baseUrl), {
			...init,
			redirect: 'manual',
			headers: { cookie: sessions[actor], origin: baseUrl, ...(init.headers ?? {}) }
		});
}

const postJson = (body: unknown): RequestInit => ({
	method: 'POST',
	headers: { 'content-type': 'application/json' },
	body: JSON.stringify(body)
});

const postForm = (fields: Record<string, string>): RequestInit => ({
	method: 'POST',
	headers: { accept: 'application/json' },
	body: new URLSearchParams(fields)
});

type CampaignListing = { id: string; state: string; lastRevision: number; teamId: string };

export async function findFixture(
	baseUrl: string,
	sessions: Sessions,
	databasePath: string
): Promise<Fixture> {
	const get = client(baseUrl, sessions);
	const json = async (actor: Actor, path: string, init?: RequestInit) => {
		const response = await get(actor, path, init);
		if (response.status >= 400) throw new Error(`${path}: ${response.status}`);
		return response.json();
	};
	const own: CampaignListing[] = (await json('aero', '/api/v1/campaigns')).campaigns;
	const all: CampaignListing[] = (await json('reviewer', '/api/v1/campaigns')).campaigns;
	const draft = own.find((c) => c.state === 'draft')!;
	const inReview = own.find((c) => c.state === 'in-review')!;
	const approved = all.find((c) => c.state === 'approved')!;
	const {
		id: _,
		state: __,
		approvedRevisionId: ___,
		...campaignBody
	} = await json('aero', `/api/v1/campaigns/${draft.id}`);
	const spare = await json(
		'aero',
		'/api/v1/campaigns',
		postJson({ ...campaignBody, name: 'Spare' })
	);

	const facilities: { id: string }[] = (await json('aero', '/api/v1/facilities')).facilities;
	const {
		id: ____,
		createdAt: _____,
		...facilityBody
	} = (await json('aero', `/api/v1/facilities/${facilities[0]!.id}`)).facility;
	const models: { id: string }[] = (await json('aero', '/api/v1/models')).models;
	const modelRecord = (await json('aero', `/api/v1/models/${models[0]!.id}`)).model;
	const modelBody = Object.fromEntries(
		[
			'teamId',
			'name',
			'kind',
			'scaleDenominator',
			'fullScaleLength_m',
			'fullScaleWidth_m',
			'fullScaleHeight_m',
			'fullScaleFrontalArea_m2',
			'referenceLength_m',
			'dragCoefficient',
			'modelVolume_m3'
		].map((key) => [key, modelRecord[key]])
	);
	let booking = '';
	for (const { id } of facilities) {
		const found = (await json('operator', `/api/v1/facilities/${id}/bookings`)).bookings;
		booking ||= found[0]?.id ?? '';
	}
	const token = await json(
		'aero',
		'/api/v1/tokens',
		postJson({ name: 'fuzz', scopes: ['readings:read'] })
	);
	const template = await (
		await get('operator', `/campaigns/${approved.id}/readings/template.csv`)
	).text();

	const rotated = await (await get('admin', '/calendar-feed?/rotate', postForm({}))).text();
	const invited = await (
		await get(
			'admin',
			'/admin?/invite',
			postForm({
				email: 'invitee@fuzz.test',
				name: 'Invitee',
				roles: 'reviewer',
				teamIds: draft.teamId
			})
		)
	).text();

	const checkoutSession = addTestCheckoutSession(databasePath, baseUrl);
	const db = new Database(databasePath, { readonly: true, fileMustExist: true });
	const one = (sql: string, ...args: unknown[]) =>
		(db.prepare(sql).get(...args) as { id: string } | undefined)?.id ?? 'none';
	try {
		return {
			draftCampaign: draft.id,
			spareDraft: spare.id,
			inReviewCampaign: inReview.id,
			inReviewRevision: inReview.lastRevision,
			approvedCampaign: approved.id,
			readingsSample: template.split('\n').slice(0, 3).join('\n'),
			facility: facilities[0]!.id,
			facilityBody,
			campaignBody,
			model: models[0]!.id,
			modelBody,
			booking,
			token: token.id,
			feedToken: /\/calendar\/([\w-]+)\.ics/.exec(rotated)?.[1] ?? 'none',
			invitationToken: /\/invitation\/([\w-]+)/.exec(invited)?.[1] ?? 'none',
			otherUser: one(`select id from user where email = ?`, 'aero2@demo.test'),
			upload: one(`select id from readings_upload where campaign_id = ?`, approved.id),
			mail: one(`select id from mail_outbox`),
			team: draft.teamId,
			quote: one(`select id from quote where campaign_id = ?`, approved.id),
			invoice: one(`select id from invoice where campaign_id = ?`, approved.id),
			checkoutSession
		};
	} finally {
		db.close();
	}
}
