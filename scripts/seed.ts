import { and, eq, inArray } from 'drizzle-orm';
import { DateTime } from 'luxon';
import { hashPassword } from '../src/lib/server/auth/password';
import { databasePathFromEnv, migrateDatabase, openDatabase } from '../src/lib/server/db/open';
import { campaignSchema } from '../src/lib/schemas/campaign';
import {
	bookableCampaigns,
	changeBooking,
	createBooking,
	createClosure,
	proposeFor
} from '../src/lib/server/bookings';
import { decideQuote, issueInvoice, issueQuote } from '../src/lib/server/billing';
import { approvedLayout, receiveReadings } from '../src/lib/server/readings';
import { decideRevision, submitCampaign } from '../src/lib/server/review';
import { openObjectStore } from '../src/lib/server/storage/open';
import { demoReadingsCsv } from './demo-readings';
import { sessionUser } from '../src/lib/server/users';
import {
	booking,
	campaign,
	closure,
	facility,
	invoice,
	quote,
	readingsUpload,
	scaleModel,
	team,
	teamMember,
	user,
	userRole
} from '../src/lib/server/db/schema';
import {
	CLIENT_TEAMS,
	DEMO_ACCOUNTS,
	DEMO_BILLING,
	DEMO_BOOKING,
	DEMO_CAMPAIGNS,
	DEMO_FACILITIES,
	DEMO_MODELS,
	DEMO_ORIGIN,
	DEMO_PASSWORD,
	DEMO_READINGS,
	DEMO_REVIEW_STORY,
	STAFF_TEAM
} from './demo-scenario';

// Idempotent: each row is matched on its natural key and brought back to the scenario's values.
const path = databasePathFromEnv(process.env);
const db = openDatabase(path);
migrateDatabase(db);
const passwordHash = await hashPassword(DEMO_PASSWORD);

db.transaction((tx) => {
	const teamIds = new Map<string, string>();
	for (const [name, kind] of [
		[STAFF_TEAM, 'staff'],
		...CLIENT_TEAMS.map((n) => [n, 'client'] as const)
	] as const) {
		const row = tx
			.insert(team)
			.values({ name, kind })
			.onConflictDoUpdate({ target: team.name, set: { kind } })
			.returning({ id: team.id })
			.get();
		teamIds.set(name, row.id);
	}

	const userIds = new Map<string, string>();
	for (const account of DEMO_ACCOUNTS) {
		const row = tx
			.insert(user)
			.values({ email: account.email, name: account.name, passwordHash })
			.onConflictDoUpdate({
				target: user.email,
				set: { name: account.name, passwordHash, active: true }
			})
			.returning({ id: user.id })
			.get();
		userIds.set(account.email, row.id);
		tx.delete(userRole).where(eq(userRole.userId, row.id)).run();
		tx.insert(userRole)
			.values(account.roles.map((role) => ({ userId: row.id, role })))
			.run();
		tx.delete(teamMember).where(eq(teamMember.userId, row.id)).run();
		tx.insert(teamMember)
			.values({ userId: row.id, teamId: teamIds.get(account.team)! })
			.run();
	}

	for (const values of DEMO_FACILITIES) {
		tx.insert(facility)
			.values(values)
			.onConflictDoUpdate({ target: facility.name, set: values })
			.run();
	}

	const modelIds = new Map<string, { id: string; teamId: string }>();
	for (const { team: teamName, owner, model } of DEMO_MODELS) {
		const teamId = teamIds.get(teamName)!;
		const row = tx
			.insert(scaleModel)
			.values({ ...model, teamId, createdBy: userIds.get(owner) })
			.onConflictDoUpdate({ target: [scaleModel.teamId, scaleModel.name], set: model })
			.returning({ id: scaleModel.id })
			.get();
		modelIds.set(model.name, { id: row.id, teamId });
	}

	const facilityIds = new Map(
		tx
			.select({ id: facility.id, name: facility.name })
			.from(facility)
			.all()
			.map((f) => [f.name, f.id])
	);
	for (const seed of DEMO_CAMPAIGNS) {
		const model = modelIds.get(seed.model)!;
		// Demo campaigns pass the same checks as any other.
		const { name, objective, modelId, facilityId, ...definition } = campaignSchema.parse({
			...seed.input,
			modelId: model.id,
			facilityId: facilityIds.get(seed.facility)!
		});
		const values = {
			name,
			objective,
			modelId,
			facilityId,
			definition,
			teamId: model.teamId,
			ownerId: userIds.get(seed.owner)!
		};
		const existing = tx
			.select({ id: campaign.id, lastRevision: campaign.lastRevision })
			.from(campaign)
			.where(and(eq(campaign.teamId, model.teamId), eq(campaign.name, name)))
			.get();
		// A campaign already in review keeps its history; only drafts never submitted follow the scenario.
		if (!existing) tx.insert(campaign).values(values).run();
		else if (existing.lastRevision === 0)
			tx.update(campaign).set(values).where(eq(campaign.id, existing.id)).run();
	}
});

// The review story of the scenario, told through the same workflow functions the app uses.
const person = (email: string) => {
	const row = db.select().from(user).where(eq(user.email, email)).get()!;
	return sessionUser(db, row.id, row.sessionVersion)!;
};
const reviewer = person('reviewer@demo.test');
for (const step of DEMO_REVIEW_STORY) {
	const c = db.select().from(campaign).where(eq(campaign.name, step.campaign)).get()!;
	if (c.lastRevision > 0) continue;
	const owner = person(step.owner);
	const submitted = submitCampaign(db, owner, c.id, DEMO_ORIGIN);
	if (!submitted.ok) throw new Error(`${step.campaign}: ${submitted.message}`);
	if (step.decision) {
		const decided = decideRevision(
			db,
			reviewer,
			c.id,
			{ revision: submitted.revision, ...step.decision },
			DEMO_ORIGIN
		);
		if (!decided.ok) throw new Error(`${step.campaign}: ${decided.message}`);
	}
}

console.log(
	`Seeded ${path}: ${DEMO_ACCOUNTS.length} accounts, ${DEMO_FACILITIES.length} facilities, ${DEMO_MODELS.length} models, ${DEMO_CAMPAIGNS.length} campaigns.`
);

// Put the approved demo campaign on the calendar over the coming days, around a closure.
const operator = person('operator@demo.test');
const plover = db.select().from(facility).where(eq(facility.name, DEMO_BOOKING.facility)).get()!;
const tomorrow = DateTime.now().setZone(plover.timeZone).plus({ days: 1 }).startOf('day');
if (!db.select().from(closure).where(eq(closure.facilityId, plover.id)).get()) {
	const day = tomorrow.plus({ days: DEMO_BOOKING.closure.inDays });
	createClosure(db, operator, plover.id, {
		kind: DEMO_BOOKING.closure.kind,
		reason: DEMO_BOOKING.closure.reason,
		start: day.toJSDate(),
		end: day.plus({ days: 1 }).toJSDate()
	});
}
const approvedDemo = db
	.select()
	.from(campaign)
	.where(eq(campaign.name, DEMO_BOOKING.campaign))
	.get()!;
// The client accepted the open jet's quote before any slot was booked.
if (!db.select().from(quote).where(eq(quote.campaignId, approvedDemo.id)).get()) {
	const quoted = issueQuote(db, operator, approvedDemo.id, DEMO_ORIGIN);
	if (!quoted.ok) throw new Error(`Demo quote: ${quoted.message}`);
	const accepted = decideQuote(
		db,
		person(DEMO_BILLING.client),
		quoted.quote.id,
		{ decision: 'accept', note: DEMO_BILLING.acceptanceNote },
		DEMO_ORIGIN
	);
	if (!accepted.ok) throw new Error(`Demo quote: ${accepted.message}`);
}
// A first half-day of flow checks ran two weeks ago and has been invoiced.
if (!db.select().from(invoice).where(eq(invoice.campaignId, approvedDemo.id)).get()) {
	const { weeksAgo, weekday, from, to } = DEMO_BILLING.completed;
	const dayRun = DateTime.now()
		.setZone(plover.timeZone)
		.minus({ weeks: weeksAgo })
		.set({ weekday });
	const at = (clock: string) =>
		DateTime.fromISO(`${dayRun.toISODate()}T${clock}`, { zone: plover.timeZone }).toJSDate();
	const booked = createBooking(
		db,
		operator,
		plover.id,
		{ campaignId: approvedDemo.id, start: at(from), end: at(to), note: 'Flow checks' },
		DEMO_ORIGIN,
		at(from).getTime() - 7 * 86_400_000
	);
	if (!booked.ok) throw new Error(`Demo past slot: ${booked.message}`);
	for (const state of ['confirmed', 'completed'] as const) {
		const moved = changeBooking(db, operator, booked.id, { state }, 'any', DEMO_ORIGIN);
		if (!moved.ok) throw new Error(`Demo past slot: ${moved.message}`);
	}
	const invoiced = issueInvoice(db, operator, approvedDemo.id, DEMO_ORIGIN);
	if (!invoiced.ok) throw new Error(`Demo invoice: ${invoiced.message}`);
}
if (
	!db
		.select()
		.from(booking)
		.where(
			and(
				eq(booking.campaignId, approvedDemo.id),
				inArray(booking.state, ['pencilled', 'confirmed'])
			)
		)
		.get()
) {
	const [waiting] = bookableCampaigns(db, plover.id).filter((c) => c.id === approvedDemo.id);
	const proposal = proposeFor(db, plover.id, waiting!.occupancy_s, tomorrow.toMillis());
	if (!proposal.ok) throw new Error(`Demo booking: ${proposal.message}`);
	for (const slot of proposal.slots) {
		const booked = createBooking(
			db,
			operator,
			plover.id,
			{
				campaignId: approvedDemo.id,
				start: new Date(slot.start),
				end: new Date(slot.end),
				note: ''
			},
			DEMO_ORIGIN
		);
		if (!booked.ok) throw new Error(`Demo booking: ${booked.message}`);
	}
}

// The tunnel's acquisition computer has sent back the first wake surveys of the approved campaign.
const surveyed = db.select().from(campaign).where(eq(campaign.name, DEMO_READINGS.campaign)).get()!;
if (!db.select().from(readingsUpload).where(eq(readingsUpload.campaignId, surveyed.id)).get()) {
	const approved = approvedLayout(db, surveyed.approvedRevisionId!);
	if (!approved.ok) throw new Error(`Demo readings: ${approved.message}`);
	const files = await openObjectStore(process.env);
	const received = await receiveReadings(
		db,
		files.store,
		person(DEMO_READINGS.sender),
		surveyed.id,
		{
			fileName: DEMO_READINGS.fileName,
			mediaType: 'text/csv',
			bytes: new TextEncoder().encode(demoReadingsCsv(approved.plan, approved.layout)),
			channel: 'api'
		}
	).finally(() => files.close());
	if (!received.ok) throw new Error(`Demo readings: ${received.message}`);
}

db.$client.close();
