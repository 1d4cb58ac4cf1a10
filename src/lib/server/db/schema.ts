import { sql } from 'drizzle-orm';
import {
	index,
	integer,
	primaryKey,
	real,
	sqliteTable,
	text,
	uniqueIndex
} from 'drizzle-orm/sqlite-core';
import { ROLES, TEAM_KINDS } from '../../roles';
import { VERSIONED_KINDS } from '../../versions';
import { MODEL_KINDS, SECTION_KINDS } from '../../calc/kinds';
import { DEFAULT_TUNNEL_SHAPE_FACTOR } from '../../calc/blockage';
import type { CampaignDefinition } from '../../schemas/campaign';
import type { NoteAnchor, RevisionSnapshot } from '../../review/types';
import { BOOKING_STATES, CLOSURE_KINDS } from '../../booking/rules';
import { CAMPAIGN_ACTIONS, CAMPAIGN_STATES, VERDICTS } from '../../workflow';
import type { ApiTokenScope } from '../../schemas/api-token';
import { INSTRUMENT_UNCERTAINTY_DEFAULTS, SLOT_DEFAULTS } from '../../schemas/facility';
import { READING_KINDS } from '../../schemas/readings';
import {
	BILLING_ACTIONS,
	INVOICE_KINDS,
	QUOTE_STATES,
	type FacilityRates,
	type PriceLine
} from '../../billing/types';

const id = () =>
	text('id')
		.primaryKey()
		.$defaultFn(() => crypto.randomUUID());
const createdAt = () =>
	integer('created_at', { mode: 'timestamp_ms' })
		.notNull()
		.default(sql`(unixepoch('subsec') * 1000)`);
/**
 * Optimistic concurrency for records people edit: every write names the version it read and
 * bumps it by one, so two writers who read the same version cannot both win.
 */
const versioned = () => ({
	version: integer('version').notNull().default(1),
	updatedBy: text('updated_by').references(() => user.id, { onDelete: 'set null' }),
	// Set by the app as well: the column added to older tables carries a constant default.
	updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
		.notNull()
		.default(sql`(unixepoch('subsec') * 1000)`)
		.$defaultFn(() => new Date())
});

/** People who sign in; Auth.js keeps no table of its own, as sessions are signed tokens. */
export const user = sqliteTable('user', {
	id: id(),
	name: text('name'),
	email: text('email').notNull().unique(),
	passwordHash: text('password_hash'),
	active: integer('active', { mode: 'boolean' }).notNull().default(true),
	/** Bumped to end every session of the user at once (deactivation, password change). */
	sessionVersion: integer('session_version').notNull().default(1),
	createdAt: createdAt()
});

export const userRole = sqliteTable(
	'user_role',
	{
		userId: text('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		role: text('role', { enum: ROLES }).notNull()
	},
	(t) => [primaryKey({ columns: [t.userId, t.role] })]
);

/** The facility's own staff form one team; each client organisation forms another. */
export const team = sqliteTable('team', {
	id: id(),
	name: text('name').notNull().unique(),
	kind: text('kind', { enum: TEAM_KINDS }).notNull(),
	createdAt: createdAt()
});

export const teamMember = sqliteTable(
	'team_member',
	{
		teamId: text('team_id')
			.notNull()
			.references(() => team.id, { onDelete: 'cascade' }),
		userId: text('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' })
	},
	(t) => [primaryKey({ columns: [t.teamId, t.userId] }), index('team_member_user').on(t.userId)]
);

/** One-time set-password links; only a hash of the token is stored. */
export const invitation = sqliteTable(
	'invitation',
	{
		id: id(),
		userId: text('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		tokenHash: text('token_hash').notNull(),
		createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
		expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
		usedAt: integer('used_at', { mode: 'timestamp_ms' }),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('invitation_token').on(t.tokenHash)]
);

/** Failed sign-ins, keyed by account (`account:<email>`) and by address (`address:<ip>`). */
export const signInThrottle = sqliteTable('sign_in_throttle', {
	key: text('key').primaryKey(),
	failures: integer('failures').notNull(),
	windowStartedAt: integer('window_started_at', { mode: 'timestamp_ms' }).notNull(),
	lockedUntil: integer('locked_until', { mode: 'timestamp_ms' })
});

/** Values the server generates once and keeps, such as the session-signing secret. */
export const appSetting = sqliteTable('app_setting', {
	key: text('key').primaryKey(),
	value: text('value').notNull()
});

export const facility = sqliteTable('facility', {
	id: id(),
	name: text('name').notNull().unique(),
	sectionKind: text('section_kind', { enum: SECTION_KINDS }).notNull(),
	sectionWidth_m: real('section_width_m').notNull(),
	sectionHeight_m: real('section_height_m').notNull(),
	cornerFillet_m: real('corner_fillet_m').notNull().default(0),
	sectionLength_m: real('section_length_m').notNull(),
	minSpeed_mps: real('min_speed_mps').notNull(),
	maxSpeed_mps: real('max_speed_mps').notNull(),
	maxDynamicPressure_Pa: real('max_dynamic_pressure_pa').notNull(),
	yawMin_deg: real('yaw_min_deg').notNull(),
	yawMax_deg: real('yaw_max_deg').notNull(),
	blockageCaution: real('blockage_caution').notNull(),
	blockageLimit: real('blockage_limit').notNull(),
	settling_s: real('settling_s').notNull(),
	traverseMove_s: real('traverse_move_s').notNull(),
	yawChange_s: real('yaw_change_s').notNull(),
	modelChange_s: real('model_change_s').notNull(),
	setUp_s: real('set_up_s').notNull(),
	tearDown_s: real('tear_down_s').notNull(),
	/** Weekly opening hours as JSON: `{ "mon": ["08:00", "18:00"], ... }` in the facility's zone. */
	openingHours: text('opening_hours', { mode: 'json' })
		.$type<Record<string, [string, string]>>()
		.notNull(),
	timeZone: text('time_zone').notNull(),
	/** Decimal string, so money never passes through binary floating point. */
	hourlyRate: text('hourly_rate').notNull(),
	currency: text('currency').notNull(),
	/** Charged once per campaign, on its first invoice; decimal strings like the rate. */
	setUpFee: text('set_up_fee').notNull().default('0.00'),
	tearDownFee: text('tear_down_fee').notNull().default('0.00'),
	/** The least a quote or invoice comes to before tax. */
	minimumCharge: text('minimum_charge').notNull().default('0.00'),
	taxRate_percent: text('tax_rate_percent').notNull().default('0'),
	quoteValidity_days: integer('quote_validity_days').notNull().default(30),
	/** Whether a slot may be booked only for a campaign whose client accepted a quote. */
	quoteRequiredForBooking: integer('quote_required_for_booking', { mode: 'boolean' })
		.notNull()
		.default(false),
	siteAltitude_m: real('site_altitude_m').notNull(),
	typicalTemperature_K: real('typical_temperature_k').notNull(),
	typicalRelativeHumidity: real('typical_relative_humidity').notNull(),
	tunnelShapeFactor: real('tunnel_shape_factor').notNull().default(DEFAULT_TUNNEL_SHAPE_FACTOR),
	readingUncertainty_Pa: real('reading_uncertainty_pa')
		.notNull()
		.default(INSTRUMENT_UNCERTAINTY_DEFAULTS.readingUncertainty_Pa),
	referenceQUncertainty: real('reference_q_uncertainty')
		.notNull()
		.default(INSTRUMENT_UNCERTAINTY_DEFAULTS.referenceQUncertainty),
	temperatureUncertainty_K: real('temperature_uncertainty_k')
		.notNull()
		.default(INSTRUMENT_UNCERTAINTY_DEFAULTS.temperatureUncertainty_K),
	barometricUncertainty_Pa: real('barometric_uncertainty_pa')
		.notNull()
		.default(INSTRUMENT_UNCERTAINTY_DEFAULTS.barometricUncertainty_Pa),
	humidityUncertainty: real('humidity_uncertainty')
		.notNull()
		.default(INSTRUMENT_UNCERTAINTY_DEFAULTS.humidityUncertainty),
	/** Shortest slot the calendar proposes, in seconds. */
	minimumSlot_s: real('minimum_slot_s').notNull().default(SLOT_DEFAULTS.minimumSlot_s),
	/** Grid of the facility's clock that proposed slots start and end on, in seconds. */
	slotStep_s: real('slot_step_s').notNull().default(SLOT_DEFAULTS.slotStep_s),
	createdAt: createdAt(),
	...versioned()
});

export const scaleModel = sqliteTable(
	'scale_model',
	{
		id: id(),
		teamId: text('team_id')
			.notNull()
			.references(() => team.id, { onDelete: 'restrict' }),
		name: text('name').notNull(),
		kind: text('kind', { enum: MODEL_KINDS }).notNull(),
		/** N of a 1:N scale. */
		scaleDenominator: real('scale_denominator').notNull(),
		fullScaleLength_m: real('full_scale_length_m').notNull(),
		fullScaleWidth_m: real('full_scale_width_m').notNull(),
		fullScaleHeight_m: real('full_scale_height_m').notNull(),
		fullScaleFrontalArea_m2: real('full_scale_frontal_area_m2').notNull(),
		/** The length Re is based on, at full scale. */
		referenceLength_m: real('reference_length_m').notNull(),
		dragCoefficient: real('drag_coefficient'),
		modelVolume_m3: real('model_volume_m3'),
		createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
		createdAt: createdAt(),
		...versioned()
	},
	(t) => [uniqueIndex('scale_model_team_name').on(t.teamId, t.name)]
);

/** Drawings and photos of a model; the bytes live in attachment storage under `storageKey`. */
export const modelAttachment = sqliteTable(
	'model_attachment',
	{
		id: id(),
		modelId: text('model_id')
			.notNull()
			.references(() => scaleModel.id, { onDelete: 'cascade' }),
		fileName: text('file_name').notNull(),
		mediaType: text('media_type').notNull(),
		size_bytes: integer('size_bytes').notNull(),
		storageKey: text('storage_key').notNull().unique(),
		/** Null only for files kept before checksums were; `npm run storage:migrate` fills it. */
		sha256: text('sha256'),
		uploadedBy: text('uploaded_by').references(() => user.id, { onDelete: 'set null' }),
		createdAt: createdAt()
	},
	(t) => [index('model_attachment_model').on(t.modelId)]
);

/**
 * A test campaign: one model in one facility, with its air assumption and the matrix axes.
 * The axes are one validated document (see $lib/schemas/campaign), stored as JSON.
 */
export const campaign = sqliteTable(
	'campaign',
	{
		id: id(),
		teamId: text('team_id')
			.notNull()
			.references(() => team.id, { onDelete: 'restrict' }),
		ownerId: text('owner_id')
			.notNull()
			.references(() => user.id, { onDelete: 'restrict' }),
		modelId: text('model_id')
			.notNull()
			.references(() => scaleModel.id, { onDelete: 'restrict' }),
		facilityId: text('facility_id')
			.notNull()
			.references(() => facility.id, { onDelete: 'restrict' }),
		state: text('state', { enum: CAMPAIGN_STATES }).notNull().default('draft'),
		/** The revision a booking may use: the latest approved one, kept while a new draft is open. */
		approvedRevisionId: text('approved_revision_id'),
		/** Number of the latest submitted revision; 0 for a campaign never submitted. */
		lastRevision: integer('last_revision').notNull().default(0),
		name: text('name').notNull(),
		objective: text('objective').notNull(),
		definition: text('definition', { mode: 'json' }).$type<CampaignDefinition>().notNull(),
		createdAt: createdAt(),
		...versioned()
	},
	(t) => [index('campaign_team').on(t.teamId), index('campaign_facility').on(t.facilityId)]
);

/**
 * The values of an edited record as they were before each write replaced them: who made that
 * version and when. It lets a writer whose version went stale see what changed since they read.
 */
export const editHistory = sqliteTable(
	'edit_history',
	{
		id: id(),
		kind: text('kind', { enum: VERSIONED_KINDS }).notNull(),
		recordId: text('record_id').notNull(),
		version: integer('version').notNull(),
		values: text('values', { mode: 'json' }).$type<Record<string, unknown>>().notNull(),
		madeBy: text('made_by').references(() => user.id, { onDelete: 'set null' }),
		madeAt: integer('made_at', { mode: 'timestamp_ms' }).notNull()
	},
	(t) => [uniqueIndex('edit_history_record_version').on(t.kind, t.recordId, t.version)]
);

/**
 * A submitted campaign frozen as it was: its definition, the model and facility it used, and
 * the computed figures. Never updated once written.
 */
export const campaignRevision = sqliteTable(
	'campaign_revision',
	{
		id: id(),
		campaignId: text('campaign_id')
			.notNull()
			.references(() => campaign.id, { onDelete: 'restrict' }),
		number: integer('number').notNull(),
		snapshot: text('snapshot', { mode: 'json' }).$type<RevisionSnapshot>().notNull(),
		submittedBy: text('submitted_by')
			.notNull()
			.references(() => user.id, { onDelete: 'restrict' }),
		submittedAt: createdAt()
	},
	(t) => [uniqueIndex('campaign_revision_number').on(t.campaignId, t.number)]
);

/** A reviewer's decision on one revision; the unique revision id lets only one stand. */
export const reviewDecision = sqliteTable('review_decision', {
	id: id(),
	revisionId: text('revision_id')
		.notNull()
		.unique()
		.references(() => campaignRevision.id, { onDelete: 'restrict' }),
	reviewerId: text('reviewer_id')
		.notNull()
		.references(() => user.id, { onDelete: 'restrict' }),
	verdict: text('verdict', { enum: VERDICTS }).notNull(),
	summary: text('summary').notNull(),
	createdAt: createdAt()
});

/** A reviewer's note, general or pinned to one value of a matrix axis. */
export const reviewNote = sqliteTable(
	'review_note',
	{
		id: id(),
		decisionId: text('decision_id')
			.notNull()
			.references(() => reviewDecision.id, { onDelete: 'restrict' }),
		anchor: text('anchor', { mode: 'json' }).$type<NoteAnchor>().notNull(),
		text: text('text').notNull()
	},
	(t) => [index('review_note_decision').on(t.decisionId)]
);

/** Audit entries that are not workflow transitions: readings arriving or replacing others. */
export const READINGS_ACTIONS = ['upload-readings', 'replace-readings'] as const;
const AUDIT_ACTIONS = [...CAMPAIGN_ACTIONS, ...READINGS_ACTIONS, ...BILLING_ACTIONS] as const;

/** Every transition, decision and readings upload of a campaign, kept for good. */
export const auditEvent = sqliteTable(
	'audit_event',
	{
		id: id(),
		campaignId: text('campaign_id').notNull(),
		actorId: text('actor_id').references(() => user.id, { onDelete: 'set null' }),
		actorName: text('actor_name').notNull(),
		action: text('action', { enum: AUDIT_ACTIONS }).notNull(),
		fromState: text('from_state', { enum: CAMPAIGN_STATES }).notNull(),
		toState: text('to_state', { enum: CAMPAIGN_STATES }).notNull(),
		revisionNumber: integer('revision_number'),
		notes: text('notes').notNull().default(''),
		createdAt: createdAt()
	},
	(t) => [index('audit_event_campaign').on(t.campaignId, t.createdAt)]
);

export const MAIL_STATES = ['pending', 'sent', 'failed'] as const;

/** Mail waiting to go out; written in the same transaction as what it announces. */
export const mailOutbox = sqliteTable(
	'mail_outbox',
	{
		id: id(),
		kind: text('kind').notNull(),
		to: text('to', { mode: 'json' }).$type<string[]>().notNull(),
		subject: text('subject').notNull(),
		text: text('text').notNull(),
		state: text('state', { enum: MAIL_STATES }).notNull().default('pending'),
		attempts: integer('attempts').notNull().default(0),
		nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' })
			.notNull()
			.default(sql`(unixepoch('subsec') * 1000)`),
		lastError: text('last_error'),
		sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
		createdAt: createdAt()
	},
	(t) => [index('mail_outbox_due').on(t.state, t.nextAttemptAt)]
);

/** What the local fake SMTP server received (only when no real relay is configured). */
export const caughtMail = sqliteTable('caught_mail', {
	id: id(),
	from: text('from').notNull(),
	to: text('to', { mode: 'json' }).$type<string[]>().notNull(),
	subject: text('subject').notNull(),
	text: text('text').notNull(),
	receivedAt: createdAt()
});

/** Time a facility cannot be booked. Times are UTC instants. */
export const closure = sqliteTable(
	'closure',
	{
		id: id(),
		facilityId: text('facility_id')
			.notNull()
			.references(() => facility.id, { onDelete: 'cascade' }),
		kind: text('kind', { enum: CLOSURE_KINDS }).notNull(),
		reason: text('reason').notNull(),
		start: integer('start_ms', { mode: 'timestamp_ms' }).notNull(),
		end: integer('end_ms', { mode: 'timestamp_ms' }).notNull(),
		createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
		createdAt: createdAt()
	},
	(t) => [index('closure_facility_start').on(t.facilityId, t.start)]
);

/**
 * A slot of tunnel time for an approved revision. Active slots (pencilled or confirmed) of one
 * facility never overlap; the partial index serves the overlap check.
 */
export const booking = sqliteTable(
	'booking',
	{
		id: id(),
		facilityId: text('facility_id')
			.notNull()
			.references(() => facility.id, { onDelete: 'restrict' }),
		campaignId: text('campaign_id')
			.notNull()
			.references(() => campaign.id, { onDelete: 'restrict' }),
		revisionId: text('revision_id')
			.notNull()
			.references(() => campaignRevision.id, { onDelete: 'restrict' }),
		state: text('state', { enum: BOOKING_STATES }).notNull().default('pencilled'),
		start: integer('start_ms', { mode: 'timestamp_ms' }).notNull(),
		end: integer('end_ms', { mode: 'timestamp_ms' }).notNull(),
		note: text('note').notNull().default(''),
		createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
		createdAt: createdAt(),
		...versioned()
	},
	(t) => [
		index('booking_active_start')
			.on(t.facilityId, t.start)
			.where(sql`state in ('pencilled', 'confirmed')`),
		index('booking_campaign').on(t.campaignId)
	]
);

/** The secret in a user's calendar-feed address; only its hash is kept. */
export const calendarFeed = sqliteTable('calendar_feed', {
	userId: text('user_id')
		.primaryKey()
		.references(() => user.id, { onDelete: 'cascade' }),
	tokenHash: text('token_hash').notNull().unique(),
	createdAt: createdAt()
});

/** A personal API token; it acts as its owner within its scopes. Only a hash is stored. */
export const apiToken = sqliteTable(
	'api_token',
	{
		id: id(),
		userId: text('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		name: text('name').notNull(),
		tokenHash: text('token_hash').notNull(),
		scopes: text('scopes', { mode: 'json' }).$type<ApiTokenScope[]>().notNull(),
		expiresAt: integer('expires_at', { mode: 'timestamp_ms' }),
		lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
		revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('api_token_hash').on(t.tokenHash), index('api_token_user').on(t.userId)]
);

/**
 * One readings file as it arrived, kept for provenance: the original bytes sit in attachment
 * storage under `storageKey`, with their SHA-256.
 */
export const readingsUpload = sqliteTable(
	'readings_upload',
	{
		id: id(),
		campaignId: text('campaign_id')
			.notNull()
			.references(() => campaign.id, { onDelete: 'restrict' }),
		revisionId: text('revision_id')
			.notNull()
			.references(() => campaignRevision.id, { onDelete: 'restrict' }),
		uploadedBy: text('uploaded_by').references(() => user.id, { onDelete: 'set null' }),
		uploaderName: text('uploader_name').notNull(),
		/** `page` for an upload by hand, `api` for the acquisition computer or another client. */
		channel: text('channel', { enum: ['page', 'api'] }).notNull(),
		fileName: text('file_name').notNull(),
		mediaType: text('media_type').notNull(),
		size_bytes: integer('size_bytes').notNull(),
		sha256: text('sha256').notNull(),
		storageKey: text('storage_key').notNull().unique(),
		readingCount: integer('reading_count').notNull(),
		runCount: integer('run_count').notNull(),
		/** Readings of earlier uploads this one replaced. */
		replacedCount: integer('replaced_count').notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [index('readings_upload_campaign').on(t.campaignId, t.createdAt)]
);

/**
 * One probe reading of one planned point, as uploaded and converted to pascals. A point holds
 * at most one current reading of each kind; a replaced one is kept with `supersededBy` set.
 */
export const reading = sqliteTable(
	'reading',
	{
		id: integer('id').primaryKey({ autoIncrement: true }),
		revisionId: text('revision_id')
			.notNull()
			.references(() => campaignRevision.id, { onDelete: 'restrict' }),
		uploadId: text('upload_id')
			.notNull()
			.references(() => readingsUpload.id, { onDelete: 'restrict' }),
		point: integer('point').notNull(),
		run: integer('run').notNull(),
		kind: text('kind', { enum: READING_KINDS }).notNull(),
		/** Gauge pressure against the free-stream static for static and total, else absolute. */
		pressure_Pa: real('pressure_pa').notNull(),
		value: real('value').notNull(),
		unit: text('unit').notNull(),
		inclination_deg: real('inclination_deg'),
		fluidDensity_kgm3: real('fluid_density_kgm3'),
		measuredAt: integer('measured_at', { mode: 'timestamp_ms' }),
		note: text('note'),
		supersededBy: text('superseded_by').references(() => readingsUpload.id, {
			onDelete: 'restrict'
		})
	},
	(t) => [
		// The only index: each run is a contiguous range of point numbers, so reading a run or a
		// revision's coverage seeks this one too, and every further index slows bulk uploads.
		uniqueIndex('reading_current')
			.on(t.revisionId, t.point, t.kind)
			.where(sql`superseded_by is null`)
	]
);

/** A run's reference conditions as uploaded: one current set per run, replaced ones kept. */
export const runCondition = sqliteTable(
	'run_condition',
	{
		id: integer('id').primaryKey({ autoIncrement: true }),
		revisionId: text('revision_id')
			.notNull()
			.references(() => campaignRevision.id, { onDelete: 'restrict' }),
		uploadId: text('upload_id')
			.notNull()
			.references(() => readingsUpload.id, { onDelete: 'restrict' }),
		run: integer('run').notNull(),
		referenceDynamicPressure_Pa: real('reference_dynamic_pressure_pa').notNull(),
		airTemperature_K: real('air_temperature_k').notNull(),
		barometricPressure_Pa: real('barometric_pressure_pa').notNull(),
		relativeHumidity: real('relative_humidity'),
		supersededBy: text('superseded_by').references(() => readingsUpload.id, {
			onDelete: 'restrict'
		})
	},
	(t) => [
		uniqueIndex('run_condition_current')
			.on(t.revisionId, t.run)
			.where(sql`superseded_by is null`)
	]
);

/**
 * A priced offer of tunnel time for one approved revision. It keeps the facility's rates as they
 * were when issued (with the facility version they came from), so later rate changes leave it be.
 * Only its state and the client's decision change after it is issued.
 */
export const quote = sqliteTable(
	'quote',
	{
		id: id(),
		campaignId: text('campaign_id')
			.notNull()
			.references(() => campaign.id, { onDelete: 'restrict' }),
		revisionId: text('revision_id')
			.notNull()
			.references(() => campaignRevision.id, { onDelete: 'restrict' }),
		revisionNumber: integer('revision_number').notNull(),
		facilityId: text('facility_id')
			.notNull()
			.references(() => facility.id, { onDelete: 'restrict' }),
		teamId: text('team_id')
			.notNull()
			.references(() => team.id, { onDelete: 'restrict' }),
		facilityVersion: integer('facility_version').notNull(),
		rates: text('rates', { mode: 'json' }).$type<FacilityRates>().notNull(),
		state: text('state', { enum: QUOTE_STATES }).notNull().default('issued'),
		occupied_s: real('occupied_s').notNull(),
		lines: text('lines', { mode: 'json' }).$type<PriceLine[]>().notNull(),
		subtotal: text('subtotal').notNull(),
		tax: text('tax').notNull(),
		total: text('total').notNull(),
		validUntil: integer('valid_until', { mode: 'timestamp_ms' }).notNull(),
		issuedBy: text('issued_by').references(() => user.id, { onDelete: 'set null' }),
		issuedAt: createdAt(),
		decidedBy: text('decided_by').references(() => user.id, { onDelete: 'set null' }),
		decidedAt: integer('decided_at', { mode: 'timestamp_ms' }),
		decisionNote: text('decision_note').notNull().default('')
	},
	(t) => [index('quote_campaign').on(t.campaignId, t.issuedAt)]
);

/**
 * An invoice or a credit note, numbered in one unbroken sequence per facility. What it bills is
 * never changed once issued; only the payment columns and `creditedBy` are set later.
 */
export const invoice = sqliteTable(
	'invoice',
	{
		id: id(),
		facilityId: text('facility_id')
			.notNull()
			.references(() => facility.id, { onDelete: 'restrict' }),
		number: integer('number').notNull(),
		kind: text('kind', { enum: INVOICE_KINDS }).notNull(),
		campaignId: text('campaign_id')
			.notNull()
			.references(() => campaign.id, { onDelete: 'restrict' }),
		teamId: text('team_id')
			.notNull()
			.references(() => team.id, { onDelete: 'restrict' }),
		quoteId: text('quote_id').references(() => quote.id, { onDelete: 'restrict' }),
		/** The invoice a credit note corrects. */
		creditsInvoiceId: text('credits_invoice_id'),
		rates: text('rates', { mode: 'json' }).$type<FacilityRates>().notNull(),
		occupied_s: real('occupied_s').notNull(),
		lines: text('lines', { mode: 'json' }).$type<PriceLine[]>().notNull(),
		subtotal: text('subtotal').notNull(),
		tax: text('tax').notNull(),
		total: text('total').notNull(),
		reason: text('reason').notNull().default(''),
		issuedBy: text('issued_by').references(() => user.id, { onDelete: 'set null' }),
		issuedAt: createdAt(),
		/** The credit note that cancelled this invoice. */
		creditedBy: text('credited_by'),
		checkoutSessionId: text('checkout_session_id'),
		paidAt: integer('paid_at', { mode: 'timestamp_ms' }),
		paymentEventId: text('payment_event_id')
	},
	(t) => [
		uniqueIndex('invoice_facility_number').on(t.facilityId, t.number),
		index('invoice_team').on(t.teamId, t.issuedAt),
		index('invoice_campaign').on(t.campaignId)
	]
);

/** The completed slots an invoice bills; a slot is billed again only after a credit note. */
export const invoiceSlot = sqliteTable(
	'invoice_slot',
	{
		invoiceId: text('invoice_id')
			.notNull()
			.references(() => invoice.id, { onDelete: 'restrict' }),
		bookingId: text('booking_id')
			.notNull()
			.references(() => booking.id, { onDelete: 'restrict' }),
		start: integer('start_ms', { mode: 'timestamp_ms' }).notNull(),
		end: integer('end_ms', { mode: 'timestamp_ms' }).notNull()
	},
	(t) => [
		primaryKey({ columns: [t.invoiceId, t.bookingId] }),
		index('invoice_slot_booking').on(t.bookingId)
	]
);

/** Payment-service events already handled, by their id, so a replayed one changes nothing. */
export const paymentEvent = sqliteTable('payment_event', {
	eventId: text('event_id').primaryKey(),
	type: text('type').notNull(),
	invoiceId: text('invoice_id'),
	receivedAt: createdAt()
});

/**
 * Checkout sessions of the local stand-in for the payment service (only when no real account is
 * configured), kept in the database so every app process serves the same ones.
 */
export const fakeCheckoutSession = sqliteTable('fake_checkout_session', {
	id: text('id').primaryKey(),
	amount_minor: integer('amount_minor').notNull(),
	currency: text('currency').notNull(),
	description: text('description').notNull(),
	metadata: text('metadata', { mode: 'json' }).$type<Record<string, string>>().notNull(),
	clientReferenceId: text('client_reference_id'),
	successUrl: text('success_url').notNull(),
	cancelUrl: text('cancel_url').notNull(),
	status: text('status', { enum: ['open', 'complete', 'expired'] })
		.notNull()
		.default('open'),
	paymentStatus: text('payment_status', { enum: ['unpaid', 'paid'] })
		.notNull()
		.default('unpaid'),
	createdAt: createdAt()
});
