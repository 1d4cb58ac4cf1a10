/**
 * What the fuzz cannot read off the file system: who uses each route, the record each path
 * parameter names, and a valid body per route for the fuzz to spoil.
 */
import { FilePart } from './fuzz-arbitraries';
import type { Actor } from './fuzz-app';
import type { Sample } from './fuzz-bodies';
import type { Fixture } from './fuzz-fixture';
import { targetName, type Target } from './fuzz-routes';

/** Who uses each route: the first pattern matching the target's name wins. */
const PRIMARY_ACTORS: [RegExp, Actor][] = [
	[/decisions|\/revisions\/\[n\]\?\/decide|review-queue/, 'reviewer'],
	[/results/, 'reviewer'],
	[/\/readings/, 'operator'],
	[
		/bookings|closures|facilities\/\[id\]\/calendar|facilities\/new|facilities\/\[id\]\/edit/,
		'operator'
	],
	[/(POST|PUT) \/api\/v1\/facilities/, 'operator'],
	[/quote|invoices/, 'operator'],
	[/\/admin/, 'admin'],
	[/\(auth\)|signout|calendar\/\[token\]/, 'anonymous']
];

export function primaryActor(target: Target): Actor {
	const name = targetName(target);
	return PRIMARY_ACTORS.find(([pattern]) => pattern.test(name))?.[1] ?? 'aero';
}

/** The record each path parameter names; the delete routes get the spare draft. */
export function paramsFor(target: Target, fx: Fixture): Record<string, string> {
	const name = targetName(target);
	const deletes = /DELETE \/api\/v1\/campaigns|\?\/delete/.test(name);
	const campaign = deletes
		? fx.spareDraft
		: /decisions|revisions|submit|withdraw|PUT|edit/.test(name)
			? /PUT|edit|submit/.test(name)
				? fx.draftCampaign
				: fx.inReviewCampaign
			: /readings|results|matrix.csv|quote/.test(name)
				? fx.approvedCampaign
				: fx.draftCampaign;
	const id = name.includes('/campaigns/')
		? campaign
		: name.includes('/facilities/')
			? fx.facility
			: name.includes('/models/')
				? fx.model
				: name.includes('/bookings/')
					? fx.booking
					: name.includes('/tokens/')
						? fx.token
						: name.includes('/quotes/')
							? fx.quote
							: name.includes('/invoices/')
								? fx.invoice
								: 'none';
	return {
		id,
		n: String(fx.inReviewRevision),
		upload: fx.upload,
		attachmentId: 'none',
		session: fx.checkoutSession,
		token: name.includes('invitation') ? fx.invitationToken : `${fx.feedToken}.ics`
	};
}

const iso = (days: number, hour: number) =>
	new Date(Date.UTC(2027, 0, 4 + days, hour)).toISOString();
const local = (days: number, hour: number) => iso(days, hour).slice(0, 16);

/** A valid body per route, by target name; a route not listed gets nothing to spoil. */
export function samples(fx: Fixture): Record<string, Sample> {
	const json = (value: unknown): Sample => ({ kind: 'json', value });
	const form = (fields: Record<string, string | string[] | FilePart>): Sample => ({
		kind: 'form',
		fields: Object.entries(fields).flatMap(([name, v]) =>
			(Array.isArray(v) ? v : [v]).map((x) => [name, x] as [string, string | FilePart])
		)
	});
	const isa = { model: 'isa', geopotentialAltitude: 0 };
	const booking = { campaignId: fx.approvedCampaign, start: iso(0, 8), end: iso(0, 10), note: 'x' };
	const closure = { kind: 'maintenance', reason: 'Fan check', start: iso(1, 8), end: iso(1, 9) };
	const decision = { revision: fx.inReviewRevision, verdict: 'approve', summary: '', notes: [] };
	const csv = new FilePart('readings.csv', 'text/csv', fx.readingsSample);
	return {
		'POST /api/v1/calc/atmosphere': json({
			model: 'measured',
			temperature: { value: 20, unit: 'C' },
			pressure: 101325,
			relativeHumidity: 0.5
		}),
		'POST /api/v1/calc/similarity': json({
			scale: 0.25,
			fullScaleLength: 4.5,
			fullScaleSpeed: { value: 100, unit: 'km/h' },
			modelSpeed: 40,
			fullScaleAir: isa,
			tunnelAir: isa
		}),
		'POST /api/v1/calc/blockage': json({
			method: 'catch-all',
			frontalArea: 0.12,
			section: { kind: 'closed', width: 2, height: 1.5 }
		}),
		'POST /api/v1/calc/matrix': json({
			configurations: [{ id: 'base', baseline: true }],
			speeds: [20, 30],
			yawAngles_deg: [0, 5],
			planes: [
				{
					id: 'x1',
					downstream: 0.5,
					grid: { rows: 3, columns: 3, rowSpacing: 0.02, columnSpacing: 0.02 }
				}
			],
			dwellPerPoint: 10,
			repeats: 1,
			modelReferenceLength: 0.5,
			tunnelAir: isa,
			limit: 10
		}),
		'POST /api/v1/campaigns': json(fx.campaignBody),
		'PUT /api/v1/campaigns/[id]': json(fx.campaignBody),
		'POST /api/v1/campaigns/[id]/decisions': json(decision),
		'POST /api/v1/campaigns/[id]/readings': {
			kind: 'text',
			text: fx.readingsSample,
			mediaType: 'text/csv'
		},
		'POST /api/v1/facilities': json({ ...fx.facilityBody, name: 'Fuzz tunnel' }),
		'PUT /api/v1/facilities/[id]': json(fx.facilityBody),
		'POST /api/v1/facilities/[id]/bookings': json(booking),
		'POST /api/v1/facilities/[id]/closures': json(closure),
		'PATCH /api/v1/bookings/[id]': json({ note: 'moved' }),
		'POST /api/v1/models': json(fx.modelBody),
		'POST /api/v1/invoices': json({ campaignId: fx.approvedCampaign }),
		'POST /api/v1/quotes/[id]/acceptance': json({ decision: 'accept', note: '' }),
		'POST /(app)/campaigns/[id]/quote?/answer': form({ decision: 'decline', note: 'fuzz' }),
		'POST /(app)/invoices/[id]?/credit': form({ reason: 'fuzz' }),
		'PUT /api/v1/models/[id]': json(fx.modelBody),
		'POST /api/v1/tokens': json({ name: 'fuzz', scopes: ['readings:read'] }),
		'POST /(app)/account?/create': form({ name: 'fuzz', scopes: 'readings:read', expiresAt: '' }),
		'POST /(app)/account?/revoke': form({ tokenId: fx.token }),
		'POST /(app)/admin?/invite': form({
			email: 'new@fuzz.test',
			name: 'New',
			roles: 'reviewer',
			teamIds: fx.team
		}),
		'POST /(app)/admin?/roles': form({ userId: fx.otherUser, roles: ['aerodynamicist'] }),
		'POST /(app)/admin?/deactivate': form({ userId: fx.otherUser }),
		'POST /(app)/admin?/reactivate': form({ userId: fx.otherUser }),
		'POST /(app)/admin?/reissue': form({ userId: fx.otherUser }),
		'POST /(app)/admin?/endSessions': form({ userId: fx.otherUser }),
		'POST /(app)/admin/outbox?/retry': form({ id: fx.mail }),
		'POST /(app)/campaigns/[id]?/readings': form({ file: csv, replace: 'on' }),
		'POST /(app)/campaigns/[id]/edit': { kind: 'superform', value: fx.campaignBody },
		'POST /(app)/campaigns/new': { kind: 'superform', value: fx.campaignBody },
		'POST /(app)/campaigns/[id]/revisions/[n]?/decide': { kind: 'superform', value: decision },
		'POST /(app)/facilities/[id]/calendar?/book': form({
			...booking,
			start: local(0, 8),
			end: local(0, 10)
		}),
		'POST /(app)/facilities/[id]/calendar?/change': form({
			bookingId: fx.booking,
			note: 'moved',
			state: 'confirmed'
		}),
		'POST /(app)/facilities/[id]/calendar?/close': form({
			...closure,
			start: local(1, 8),
			end: local(1, 9)
		}),
		'POST /(app)/facilities/[id]/edit': { kind: 'superform', value: fx.facilityBody },
		'POST /(app)/facilities/new': {
			kind: 'superform',
			value: { ...fx.facilityBody, name: 'Fuzz' }
		},
		'POST /(app)/models/[id]?/attach': form({
			file: new FilePart('a.svg', 'image/svg+xml', '<svg/>')
		}),
		'POST /(app)/models/[id]/edit': form(
			Object.fromEntries(Object.entries(fx.modelBody).map(([k, v]) => [k, String(v ?? '')]))
		),
		'POST /(app)/models/new': form(
			Object.fromEntries(Object.entries(fx.modelBody).map(([k, v]) => [k, String(v ?? '')]))
		),
		'POST /(auth)/invitation/[token]': form({
			password: 'a-long-new-password',
			confirm: 'a-long-new-password'
		}),
		'POST /(auth)/signin': form({
			email: 'aero2@demo.test',
			password: 'not-the-password',
			redirectTo: '/'
		})
	};
}

/** Query parameters the app reads somewhere, tried on every GET. */
export const QUERY_NAMES = [
	'limit',
	'offset',
	'from',
	'to',
	'baseline',
	'tolerance',
	'facility',
	'week',
	'day',
	'model',
	'redirectTo',
	'code',
	'replace'
];
