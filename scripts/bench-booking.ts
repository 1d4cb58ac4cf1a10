/**
 * Benchmark of the booking overlap check: with 1 000 and with 100 000 existing bookings on one
 * facility, times the check for random new slots and prints both figures and their ratio. An
 * index seek keeps the ratio near 1; a scan would grow it about a hundredfold.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEMO_FACILITIES, DEMO_MODELS } from './demo-scenario';
import { collidingBooking } from '../src/lib/server/bookings';
import { migrateDatabase, openDatabase, type Db } from '../src/lib/server/db/open';
import {
	booking,
	campaign,
	campaignRevision,
	facility,
	scaleModel,
	team,
	user
} from '../src/lib/server/db/schema';

const HOUR = 3_600_000;
const T0 = Date.UTC(2027, 0, 4, 7);

function world(db: Db) {
	const teamId = db
		.insert(team)
		.values({ name: 'Bench team', kind: 'client' })
		.returning({ id: team.id })
		.get().id;
	const userId = db
		.insert(user)
		.values({ email: 'bench@example.org' })
		.returning({ id: user.id })
		.get().id;
	const facilityId = db
		.insert(facility)
		.values(DEMO_FACILITIES[0]!)
		.returning({ id: facility.id })
		.get().id;
	const modelId = db
		.insert(scaleModel)
		.values({ ...DEMO_MODELS[0]!.model, teamId })
		.returning({ id: scaleModel.id })
		.get().id;
	const campaignId = db
		.insert(campaign)
		.values({
			teamId,
			ownerId: userId,
			modelId,
			facilityId,
			name: 'Bench',
			objective: '',
			definition: {} as never,
			state: 'approved',
			lastRevision: 1
		})
		.returning({ id: campaign.id })
		.get().id;
	const revisionId = db
		.insert(campaignRevision)
		.values({ campaignId, number: 1, snapshot: {} as never, submittedBy: userId })
		.returning({ id: campaignRevision.id })
		.get().id;
	return { facilityId, campaignId, revisionId };
}

/** `count` two-hour slots, one every three hours, then timing of the check for random slots. */
function measure(count: number, checks: number): number {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-bench-'));
	const db = openDatabase(join(dir, 'bench.db'));
	try {
		migrateDatabase(db);
		const w = world(db);
		db.transaction((tx) => {
			for (let i = 0; i < count; i += 500) {
				tx.insert(booking)
					.values(
						Array.from({ length: Math.min(500, count - i) }, (_, k) => {
							const start = T0 + (i + k) * 3 * HOUR;
							return {
								facilityId: w.facilityId,
								campaignId: w.campaignId,
								revisionId: w.revisionId,
								start: new Date(start),
								end: new Date(start + 2 * HOUR)
							};
						})
					)
					.run();
			}
		});
		db.$client.pragma('optimize');
		const span = count * 3 * HOUR;
		const slots = Array.from({ length: checks }, (_, i) => {
			const start = T0 + ((i * 7919 * HOUR) % span);
			return { start, end: start + HOUR };
		});
		for (const s of slots.slice(0, 200)) collidingBooking(db, w.facilityId, s);
		const began = performance.now();
		let hits = 0;
		for (const s of slots) if (collidingBooking(db, w.facilityId, s)) hits++;
		const per_us = ((performance.now() - began) * 1000) / checks;
		if (hits === 0) throw new Error('No slot collided; the benchmark would not measure the check.');
		return per_us;
	} finally {
		db.$client.close();
		rmSync(dir, { recursive: true, force: true });
	}
}

const CHECKS = 5000;
const small = measure(1_000, CHECKS);
const large = measure(100_000, CHECKS);
console.log(`overlap check, 1 000 bookings:   ${small.toFixed(1)} µs per check (${CHECKS} checks)`);
console.log(`overlap check, 100 000 bookings: ${large.toFixed(1)} µs per check (${CHECKS} checks)`);
console.log(`ratio 100 000 / 1 000: ${(large / small).toFixed(2)} (aim ≤ 3)`);
