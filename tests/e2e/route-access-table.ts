/**
 * Who may use each page, form action and API method of the app: one line per route and call.
 * `route-access.e2e.ts` checks this list against the route files, so a new route or action
 * cannot go unlisted, and walks it against the built app for every caller.
 *
 * Callers are named relative to the line's record: `owner` is the aerodynamicist of the team
 * that owns it (for a record without a team, Alder Motorsport's), `otherTeam` the other client
 * team's aerodynamicist, and `token` a personal API token of the owner holding every scope.
 */

export const CALLERS = [
	'anonymous',
	'owner',
	'otherTeam',
	'reviewer',
	'operator',
	'admin',
	'token'
] as const;
export type Caller = (typeof CALLERS)[number];

/**
 * The records the lines point at, filled in from the seeded demo at the start of the run. Each
 * is chosen so that an allowed caller's empty or invalid request changes nothing.
 */
export const RECORDS = {
	/** Submitted and waiting for review (Alder Motorsport). */
	inReview: 'Alder',
	/** Returned for changes: a draft with one revision (Alder Motorsport). */
	returned: 'Alder',
	/** Approved, booked and with readings (Brightwater Drone Works). */
	approved: 'Brightwater',
	/** A draft never submitted, so no staff may see it yet (Brightwater Drone Works). */
	unsubmitted: 'Brightwater',
	/** Throwaway drafts the run makes, for the deletes. */
	scratchPage: 'Alder',
	scratchApi: 'Alder',
	model: 'Alder',
	attachment: 'Alder',
	facility: null,
	/** A slot of the approved campaign. */
	booking: 'Brightwater',
	/** The approved campaign's readings file. */
	upload: 'Brightwater',
	/** A throwaway API token of the owner, for the revoke. */
	apiToken: 'Alder',
	invitation: null,
	calendarFeed: null,
	/** The approved campaign's accepted quote and its first invoice, unpaid. */
	quote: 'Brightwater',
	invoice: 'Brightwater',
	/** A session of the local payment stand-in that names no invoice. */
	checkoutSession: null
} as const satisfies Record<string, 'Alder' | 'Brightwater' | null>;
export type RecordName = keyof typeof RECORDS;

/**
 * `load` for a page, `action:<name>` for a form action (`action:default` for the default one),
 * or the HTTP method of a `+server.ts` handler.
 */
export type Call = 'load' | `action:${string}` | 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export type AccessLine = {
	/** SvelteKit's route id: the folder under src/routes, groups included. */
	route: string;
	call: Call;
	/** The address called; `{record}` stands for that record's id, `{revision}` etc. for values. */
	path: string;
	allow: readonly Caller[];
	/** The record whose name a refused caller must never see; the first in `path` if not given. */
	record?: RecordName;
	/** Allowed callers that must still not see the record's name (listings filter it out). */
	conceal?: readonly Caller[];
	/** What a write sends: form fields for actions, a JSON text for the API (default `{}`). */
	form?: Record<string, string>;
	json?: string;
	/** Sent as `text/csv` instead of JSON. */
	csv?: string;
	/** Changes something when allowed (cancels, deletes, rotates, signs out): run last, one by one. */
	changes?: true;
};

const SIGNED_IN = ['owner', 'otherTeam', 'reviewer', 'operator', 'admin'] as const;
const ANYONE = ['anonymous', ...SIGNED_IN] as const;
const AERODYNAMICISTS = ['owner', 'otherTeam'] as const;
const FACILITY_STAFF = ['operator', 'admin'] as const;
/** Who reads a campaign once it is submitted: its team, reviewers, operators, administrators. */
const CAMPAIGN_READERS = ['owner', 'reviewer', 'operator', 'admin'] as const;
const STAFF = ['reviewer', 'operator'] as const;
/** Who sees a campaign's quotes and invoices: the client team billed and the facility's staff. */
const BILLING_READERS = ['owner', 'operator', 'admin'] as const;

// One line per route and call, however long, so the table reads as a table.
// prettier-ignore
export const ACCESS_TABLE: readonly AccessLine[] = [
	// Entry and sign-in
	{ route: '/', call: 'load', path: '/', allow: SIGNED_IN },
	{ route: '/(auth)/signin', call: 'load', path: '/signin', allow: ANYONE },
	{ route: '/(auth)/signin', call: 'action:default', path: '/signin', allow: ANYONE },
	{ route: '/(auth)/invitation/[token]', call: 'load', path: '/invitation/{invitation}', allow: ANYONE },
	{ route: '/(auth)/invitation/[token]', call: 'action:default', path: '/invitation/{invitation}', allow: ANYONE },
	{ route: '/signout', call: 'load', path: '/signout', allow: ANYONE },
	{ route: '/(app)/welcome', call: 'load', path: '/welcome', allow: SIGNED_IN },
	// The readiness probe ignores whatever credential comes along.
	{ route: '/healthz', call: 'GET', path: '/healthz', allow: CALLERS },

	// Account, calendar feed, administration
	{ route: '/(app)/account', call: 'load', path: '/account', allow: SIGNED_IN },
	{ route: '/(app)/account', call: 'action:create', path: '/account', allow: SIGNED_IN },
	{ route: '/(app)/account', call: 'action:revoke', path: '/account', allow: SIGNED_IN },
	{ route: '/(app)/calendar-feed', call: 'load', path: '/calendar-feed', allow: SIGNED_IN },
	{ route: '/(app)/calendar-feed', call: 'action:rotate', path: '/calendar-feed', allow: SIGNED_IN, changes: true },
	{ route: '/calendar/[token]', call: 'GET', path: '/calendar/{calendarFeed}.ics', allow: ANYONE },
	{ route: '/(app)/admin', call: 'load', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin', call: 'action:invite', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin', call: 'action:roles', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin', call: 'action:deactivate', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin', call: 'action:reactivate', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin', call: 'action:reissue', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin', call: 'action:endSessions', path: '/admin', allow: ['admin'] },
	{ route: '/(app)/admin/outbox', call: 'load', path: '/admin/outbox', allow: ['admin'] },
	{ route: '/(app)/admin/outbox', call: 'action:retry', path: '/admin/outbox', allow: ['admin'] },
	{ route: '/(app)/admin/outbox', call: 'action:send', path: '/admin/outbox', allow: ['admin'] },

	// Campaign pages
	{ route: '/(app)/campaigns', call: 'load', path: '/campaigns', record: 'unsubmitted', allow: SIGNED_IN, conceal: ['otherTeam', ...STAFF] },
	{ route: '/(app)/campaigns/new', call: 'load', path: '/campaigns/new', allow: AERODYNAMICISTS },
	{ route: '/(app)/campaigns/new', call: 'action:default', path: '/campaigns/new', allow: AERODYNAMICISTS },
	{ route: '/(app)/campaigns/[id]', call: 'load', path: '/campaigns/{approved}', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]', call: 'load', path: '/campaigns/{unsubmitted}', allow: ['owner', 'admin'] },
	{ route: '/(app)/campaigns/[id]', call: 'action:submit', path: '/campaigns/{inReview}', allow: ['owner'] },
	{ route: '/(app)/campaigns/[id]', call: 'action:withdraw', path: '/campaigns/{returned}', allow: ['owner'] },
	{ route: '/(app)/campaigns/[id]', call: 'action:revise', path: '/campaigns/{returned}', allow: ['owner'] },
	{ route: '/(app)/campaigns/[id]', call: 'action:readings', path: '/campaigns/{approved}', allow: ['owner', ...FACILITY_STAFF] },
	{ route: '/(app)/campaigns/[id]', call: 'action:delete', path: '/campaigns/{scratchPage}', allow: ['owner'], changes: true },
	{ route: '/(app)/campaigns/[id]/edit', call: 'load', path: '/campaigns/{returned}/edit', allow: ['owner'] },
	{ route: '/(app)/campaigns/[id]/edit', call: 'action:default', path: '/campaigns/{returned}/edit', allow: ['owner'] },
	{ route: '/(app)/campaigns/[id]/matrix.csv', call: 'GET', path: '/campaigns/{approved}/matrix.csv', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/run-sheet', call: 'load', path: '/campaigns/{approved}/run-sheet', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/revisions/[n]', call: 'load', path: '/campaigns/{approved}/revisions/1', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/revisions/[n]', call: 'action:decide', path: '/campaigns/{inReview}/revisions/1', allow: ['reviewer'] },
	{ route: '/(app)/campaigns/[id]/readings/template.csv', call: 'GET', path: '/campaigns/{approved}/readings/template.csv', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/readings/[upload]', call: 'GET', path: '/campaigns/{approved}/readings/{upload}', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/results', call: 'load', path: '/campaigns/{approved}/results', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/results/report', call: 'load', path: '/campaigns/{approved}/results/report', allow: CAMPAIGN_READERS },
	{ route: '/(app)/campaigns/[id]/results.csv', call: 'GET', path: '/campaigns/{approved}/results.csv', allow: CAMPAIGN_READERS },
	// Quotes and invoices: the facility's staff and the client team billed; reviewers see none.
	{ route: '/(app)/campaigns/[id]/quote', call: 'load', path: '/campaigns/{approved}/quote', allow: BILLING_READERS },
	{ route: '/(app)/campaigns/[id]/quote', call: 'action:issue', path: '/campaigns/{approved}/quote', allow: FACILITY_STAFF },
	{ route: '/(app)/campaigns/[id]/quote', call: 'action:answer', path: '/campaigns/{approved}/quote', allow: ['owner'] },
	{ route: '/(app)/campaigns/[id]/quote', call: 'action:invoice', path: '/campaigns/{approved}/quote', allow: FACILITY_STAFF },
	{ route: '/(app)/invoices', call: 'load', path: '/invoices', record: 'invoice', allow: ['owner', 'otherTeam', ...FACILITY_STAFF], conceal: ['otherTeam'] },
	{ route: '/(app)/invoices/invoices.csv', call: 'GET', path: '/invoices/invoices.csv', record: 'invoice', allow: ['owner', 'otherTeam', ...FACILITY_STAFF], conceal: ['otherTeam'] },
	{ route: '/(app)/invoices/[id]', call: 'load', path: '/invoices/{invoice}', allow: BILLING_READERS },
	{ route: '/(app)/invoices/[id]', call: 'action:credit', path: '/invoices/{invoice}', allow: FACILITY_STAFF },
	{ route: '/(app)/invoices/[id]', call: 'action:pay', path: '/invoices/{invoice}', allow: ['owner'], changes: true },
	{ route: '/(app)/review', call: 'load', path: '/review', record: 'inReview', allow: ['reviewer', 'admin'] },

	// Models
	{ route: '/(app)/models', call: 'load', path: '/models', record: 'model', allow: [...AERODYNAMICISTS, 'admin'], conceal: ['otherTeam'] },
	{ route: '/(app)/models/new', call: 'load', path: '/models/new', allow: AERODYNAMICISTS },
	{ route: '/(app)/models/new', call: 'action:default', path: '/models/new', allow: AERODYNAMICISTS },
	{ route: '/(app)/models/[id]', call: 'load', path: '/models/{model}', allow: ['owner', 'admin'] },
	{ route: '/(app)/models/[id]', call: 'action:attach', path: '/models/{model}', allow: ['owner'] },
	{ route: '/(app)/models/[id]/edit', call: 'load', path: '/models/{model}/edit', allow: ['owner'] },
	{ route: '/(app)/models/[id]/edit', call: 'action:default', path: '/models/{model}/edit', allow: ['owner'] },
	{ route: '/(app)/models/[id]/attachments/[attachmentId]', call: 'GET', path: '/models/{model}/attachments/{attachment}', record: 'attachment', allow: ['owner', 'admin'] },

	// Facilities, calendar and operations
	{ route: '/(app)/facilities', call: 'load', path: '/facilities', allow: SIGNED_IN },
	{ route: '/(app)/facilities/new', call: 'load', path: '/facilities/new', allow: FACILITY_STAFF },
	{ route: '/(app)/facilities/new', call: 'action:default', path: '/facilities/new', allow: FACILITY_STAFF },
	{ route: '/(app)/facilities/[id]', call: 'load', path: '/facilities/{facility}', allow: SIGNED_IN },
	{ route: '/(app)/facilities/[id]/edit', call: 'load', path: '/facilities/{facility}/edit', allow: FACILITY_STAFF },
	{ route: '/(app)/facilities/[id]/edit', call: 'action:default', path: '/facilities/{facility}/edit', allow: FACILITY_STAFF },
	{ route: '/(app)/facilities/[id]/calendar', call: 'load', path: '/facilities/{facility}/calendar?week={bookingDay}', record: 'booking', allow: SIGNED_IN, conceal: ['otherTeam'] },
	{ route: '/(app)/facilities/[id]/calendar', call: 'action:book', path: '/facilities/{facility}/calendar', allow: FACILITY_STAFF },
	{ route: '/(app)/facilities/[id]/calendar', call: 'action:change', path: '/facilities/{facility}/calendar', allow: FACILITY_STAFF, form: { bookingId: '{booking}', state: 'no-such-state' } },
	{ route: '/(app)/facilities/[id]/calendar', call: 'action:move', path: '/facilities/{facility}/calendar', allow: FACILITY_STAFF, form: { bookingId: '{booking}', start: 'not-a-time' } },
	{ route: '/(app)/facilities/[id]/calendar', call: 'action:close', path: '/facilities/{facility}/calendar', allow: FACILITY_STAFF },
	{ route: '/(app)/operations', call: 'load', path: '/operations', allow: FACILITY_STAFF },

	// JSON API: calculations and the signed-in user
	{ route: '/api/v1/me', call: 'GET', path: '/api/v1/me', allow: SIGNED_IN },
	{ route: '/api/v1/calc/atmosphere', call: 'POST', path: '/api/v1/calc/atmosphere', allow: SIGNED_IN },
	{ route: '/api/v1/calc/similarity', call: 'POST', path: '/api/v1/calc/similarity', allow: SIGNED_IN },
	{ route: '/api/v1/calc/blockage', call: 'POST', path: '/api/v1/calc/blockage', allow: SIGNED_IN },
	{ route: '/api/v1/calc/matrix', call: 'POST', path: '/api/v1/calc/matrix', allow: SIGNED_IN },

	// JSON API: campaigns, review, readings, results
	{ route: '/api/v1/campaigns', call: 'GET', path: '/api/v1/campaigns', record: 'unsubmitted', allow: [...SIGNED_IN, 'token'], conceal: ['otherTeam', ...STAFF] },
	{ route: '/api/v1/campaigns', call: 'POST', path: '/api/v1/campaigns', allow: AERODYNAMICISTS },
	{ route: '/api/v1/campaigns/[id]', call: 'GET', path: '/api/v1/campaigns/{inReview}', allow: [...CAMPAIGN_READERS, 'token'] },
	{ route: '/api/v1/campaigns/[id]', call: 'GET', path: '/api/v1/campaigns/{unsubmitted}', allow: ['owner', 'admin', 'token'] },
	{ route: '/api/v1/campaigns/[id]', call: 'PUT', path: '/api/v1/campaigns/{returned}', allow: ['owner'] },
	{ route: '/api/v1/campaigns/[id]', call: 'DELETE', path: '/api/v1/campaigns/{scratchApi}', allow: ['owner'], changes: true },
	{ route: '/api/v1/campaigns/[id]/submit', call: 'POST', path: '/api/v1/campaigns/{inReview}/submit', allow: ['owner'] },
	{ route: '/api/v1/campaigns/[id]/decisions', call: 'POST', path: '/api/v1/campaigns/{inReview}/decisions', allow: ['reviewer'] },
	{ route: '/api/v1/campaigns/[id]/matrix', call: 'GET', path: '/api/v1/campaigns/{approved}/matrix?limit=5', allow: [...CAMPAIGN_READERS, 'token'] },
	{ route: '/api/v1/campaigns/[id]/revisions', call: 'GET', path: '/api/v1/campaigns/{inReview}/revisions', allow: [...CAMPAIGN_READERS, 'token'] },
	{ route: '/api/v1/campaigns/[id]/revisions/[n]', call: 'GET', path: '/api/v1/campaigns/{inReview}/revisions/1', allow: [...CAMPAIGN_READERS, 'token'] },
	{ route: '/api/v1/campaigns/[id]/readings', call: 'GET', path: '/api/v1/campaigns/{approved}/readings?limit=5', allow: [...CAMPAIGN_READERS, 'token'] },
	{ route: '/api/v1/campaigns/[id]/readings', call: 'POST', path: '/api/v1/campaigns/{approved}/readings', allow: ['owner', ...FACILITY_STAFF, 'token'], csv: '' },
	{ route: '/api/v1/campaigns/[id]/results', call: 'GET', path: '/api/v1/campaigns/{approved}/results', allow: [...CAMPAIGN_READERS, 'token'] },
	{ route: '/api/v1/review-queue', call: 'GET', path: '/api/v1/review-queue', record: 'inReview', allow: ['reviewer', 'admin'] },

	// JSON API: models
	{ route: '/api/v1/models', call: 'GET', path: '/api/v1/models', record: 'model', allow: [...AERODYNAMICISTS, 'admin'], conceal: ['otherTeam'] },
	{ route: '/api/v1/models', call: 'POST', path: '/api/v1/models', allow: AERODYNAMICISTS },
	{ route: '/api/v1/models/[id]', call: 'GET', path: '/api/v1/models/{model}', allow: ['owner', 'admin'] },
	{ route: '/api/v1/models/[id]', call: 'PUT', path: '/api/v1/models/{model}', allow: ['owner'] },

	// JSON API: facilities, bookings, closures
	{ route: '/api/v1/facilities', call: 'GET', path: '/api/v1/facilities', allow: SIGNED_IN },
	{ route: '/api/v1/facilities', call: 'POST', path: '/api/v1/facilities', allow: FACILITY_STAFF },
	{ route: '/api/v1/facilities/[id]', call: 'GET', path: '/api/v1/facilities/{facility}', allow: SIGNED_IN },
	{ route: '/api/v1/facilities/[id]', call: 'PUT', path: '/api/v1/facilities/{facility}', allow: FACILITY_STAFF },
	{ route: '/api/v1/facilities/[id]/bookings', call: 'GET', path: '/api/v1/facilities/{facility}/bookings?from={rangeFrom}&to={rangeTo}', record: 'booking', allow: SIGNED_IN, conceal: ['otherTeam'] },
	{ route: '/api/v1/facilities/[id]/bookings', call: 'POST', path: '/api/v1/facilities/{facility}/bookings', allow: FACILITY_STAFF },
	{ route: '/api/v1/facilities/[id]/closures', call: 'GET', path: '/api/v1/facilities/{facility}/closures', allow: SIGNED_IN },
	{ route: '/api/v1/facilities/[id]/closures', call: 'POST', path: '/api/v1/facilities/{facility}/closures', allow: FACILITY_STAFF },
	{ route: '/api/v1/bookings/[id]', call: 'PATCH', path: '/api/v1/bookings/{booking}', allow: FACILITY_STAFF, json: '{"state":"no-such-state"}' },
	{ route: '/api/v1/bookings/[id]', call: 'DELETE', path: '/api/v1/bookings/{booking}', allow: FACILITY_STAFF, changes: true },
	{ route: '/api/v1/campaigns/[id]/quote', call: 'GET', path: '/api/v1/campaigns/{approved}/quote', allow: BILLING_READERS },
	{ route: '/api/v1/campaigns/[id]/quote', call: 'POST', path: '/api/v1/campaigns/{approved}/quote', allow: FACILITY_STAFF },
	{ route: '/api/v1/quotes/[id]/acceptance', call: 'POST', path: '/api/v1/quotes/{quote}/acceptance', allow: ['owner'] },
	{ route: '/api/v1/invoices', call: 'GET', path: '/api/v1/invoices', record: 'invoice', allow: ['owner', 'otherTeam', ...FACILITY_STAFF], conceal: ['otherTeam'] },
	{ route: '/api/v1/invoices', call: 'POST', path: '/api/v1/invoices', record: 'invoice', allow: FACILITY_STAFF },
	{ route: '/api/v1/invoices/[id]', call: 'GET', path: '/api/v1/invoices/{invoice}', allow: BILLING_READERS },

	// Payments. The service's webhook takes no session: its signature is the credential, so every
	// caller without one is answered 400, and an API token is not accepted there.
	{ route: '/api/v1/payments/webhook', call: 'POST', path: '/api/v1/payments/webhook', allow: ANYONE },
	// The local stand-in's checkout page: anyone signed in who holds the session's address.
	{ route: '/(app)/payments/test-checkout/[session]', call: 'load', path: '/payments/test-checkout/{checkoutSession}', allow: SIGNED_IN },
	{ route: '/(app)/payments/test-checkout/[session]', call: 'action:cancel', path: '/payments/test-checkout/{checkoutSession}', allow: SIGNED_IN },
	{ route: '/(app)/payments/test-checkout/[session]', call: 'action:pay', path: '/payments/test-checkout/{checkoutSession}', allow: SIGNED_IN, changes: true },

	// JSON API: personal tokens (sessions only, so a leaked token cannot mint more)
	{ route: '/api/v1/tokens', call: 'GET', path: '/api/v1/tokens', allow: SIGNED_IN },
	{ route: '/api/v1/tokens', call: 'POST', path: '/api/v1/tokens', allow: SIGNED_IN },
	{ route: '/api/v1/tokens/[id]', call: 'DELETE', path: '/api/v1/tokens/{apiToken}', allow: ['owner'], changes: true },

	// Last: signing out ends the callers' sessions.
	{ route: '/signout', call: 'action:default', path: '/signout', allow: ANYONE, changes: true }
];
