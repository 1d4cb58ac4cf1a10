import { createHash } from 'node:crypto';
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { READING_KINDS } from '../../schemas/readings';
import type { SessionUser } from '../../roles';
import { canReadCampaign, canUploadReadings } from '../access';
import type { Db, Tx } from '../db/open';
import { auditEvent, campaign, reading, readingsUpload, runCondition } from '../db/schema';
import { refuse, type Refusal } from '../outcome';
import type { BlobStore } from '../storage';
import {
	checkReadings,
	RUN_CONDITION_TOLERANCES,
	type CheckedReading,
	type RunConditions
} from './check';
import { readCsv, readJsonReadings, type ReadingProblem } from './file';
import { approvedLayout } from './layout';

export type ReadingsFile = {
	fileName: string;
	mediaType: 'text/csv' | 'application/json';
	bytes: Uint8Array;
	channel: 'page' | 'api';
};

export type ReceivePhase = 'parse' | 'check' | 'store';
export type ReceiveProgress = (phase: ReceivePhase, done: number, total: number) => void;

export type UploadSummary = {
	id: string;
	fileName: string;
	sha256: string;
	readingCount: number;
	runCount: number;
	replacedCount: number;
};

/** Why nothing was stored: the refusal, with the file's problems or the points already read. */
export type ReadingsRefusal = Refusal & {
	problems?: ReadingProblem[];
	problemCount?: number;
	points?: number[];
	pointCount?: number;
	runs?: number[];
};

export type ReceiveOutcome = ({ ok: true } & UploadSummary) | ReadingsRefusal;

const MAX_POINTS_NAMED = 100;

const conditionsAgree = (a: RunConditions, b: RunConditions) => {
	const t = RUN_CONDITION_TOLERANCES;
	const near = (x: number, y: number, tolerance: number) => Math.abs(x - y) <= tolerance;
	return (
		near(
			a.referenceDynamicPressure_Pa,
			b.referenceDynamicPressure_Pa,
			t.dynamicPressure * b.referenceDynamicPressure_Pa
		) &&
		near(a.airTemperature_K, b.airTemperature_K, t.temperature_K) &&
		near(
			a.barometricPressure_Pa,
			b.barometricPressure_Pa,
			t.barometricPressure * b.barometricPressure_Pa
		) &&
		(a.relativeHumidity === null ||
			b.relativeHumidity === null ||
			near(a.relativeHumidity, b.relativeHumidity, t.relativeHumidity))
	);
};

type Overlap = {
	/** Current readings the file would replace, as `point * kinds + kind`. */
	readingKeys: number[];
	points: number[];
	/** Runs whose stored reference conditions differ from the file's. */
	runs: number[];
	/** Runs whose stored conditions agree with the file's, kept as they are. */
	agreeingRuns: Set<number>;
};

const keyOf = (point: number, kind: string) =>
	point * READING_KINDS.length + READING_KINDS.indexOf(kind as never);

function overlapWithStored(
	tx: Tx,
	revisionId: string,
	readings: CheckedReading[],
	conditions: RunConditions[]
): Overlap {
	const stored = new Set(
		tx
			.select({ point: reading.point, kind: reading.kind })
			.from(reading)
			.where(and(eq(reading.revisionId, revisionId), isNull(reading.supersededBy)))
			.all()
			.map((r) => keyOf(r.point, r.kind))
	);
	const readingKeys: number[] = [];
	const points = new Set<number>();
	for (const r of readings) {
		const key = keyOf(r.point, r.kind);
		if (stored.has(key)) {
			readingKeys.push(key);
			points.add(r.point);
		}
	}
	const storedConditions = new Map(
		tx
			.select()
			.from(runCondition)
			.where(and(eq(runCondition.revisionId, revisionId), isNull(runCondition.supersededBy)))
			.all()
			.map((c) => [c.run, c])
	);
	const runs: number[] = [];
	const agreeingRuns = new Set<number>();
	for (const c of conditions) {
		const before = storedConditions.get(c.run);
		if (!before) continue;
		if (conditionsAgree(c, before)) agreeingRuns.add(c.run);
		else runs.push(c.run);
	}
	return { readingKeys, points: [...points].sort((a, b) => a - b), runs, agreeingRuns };
}

function conflictRefusal(overlap: Overlap): ReadingsRefusal {
	const parts = [];
	if (overlap.points.length)
		parts.push(`${overlap.points.length} point(s) already have readings of the same kind`);
	if (overlap.runs.length)
		parts.push(
			`${overlap.runs.length} run(s) already have other reference conditions (runs ${overlap.runs.slice(0, 20).join(', ')})`
		);
	return {
		...refuse(
			'conflict',
			`${parts.join(' and ')}. Nothing was stored; confirm replacing them (replace=true) to store this file.`
		),
		points: overlap.points.slice(0, MAX_POINTS_NAMED),
		pointCount: overlap.points.length,
		runs: overlap.runs
	};
}

function replacedFrom(tx: Tx, uploadId: string): string {
	const sources = tx
		.select({
			fileName: readingsUpload.fileName,
			by: readingsUpload.uploaderName,
			at: readingsUpload.createdAt,
			n: sql<number>`count(*)`
		})
		.from(reading)
		.innerJoin(readingsUpload, eq(readingsUpload.id, reading.uploadId))
		.where(eq(reading.supersededBy, uploadId))
		.groupBy(readingsUpload.id)
		.all();
	return sources
		.map(
			(s) =>
				`${s.n} from “${s.fileName}” (${s.by}, ${s.at.toISOString().slice(0, 16).replace('T', ' ')} UTC)`
		)
		.join('; ');
}

// `client` is the connection `tx` runs on: its prepared statements take part in the transaction.
function storeReadings(
	tx: Tx,
	client: Db['$client'],
	viewer: SessionUser,
	c: typeof campaign.$inferSelect,
	revisionId: string,
	file: ReadingsFile & { sha256: string; storageKey: string },
	checked: { readings: CheckedReading[]; conditions: RunConditions[] },
	replace: boolean
): ReceiveOutcome {
	const overlap = overlapWithStored(tx, revisionId, checked.readings, checked.conditions);
	if (!replace && (overlap.points.length || overlap.runs.length)) return conflictRefusal(overlap);

	const actorName = viewer.name || viewer.email;
	const upload = tx
		.insert(readingsUpload)
		.values({
			campaignId: c.id,
			revisionId,
			uploadedBy: viewer.id,
			uploaderName: actorName,
			channel: file.channel,
			fileName: file.fileName,
			mediaType: file.mediaType,
			size_bytes: file.bytes.length,
			sha256: file.sha256,
			storageKey: file.storageKey,
			readingCount: checked.readings.length,
			runCount: checked.conditions.length,
			replacedCount: overlap.readingKeys.length
		})
		.returning({ id: readingsUpload.id, createdAt: readingsUpload.createdAt })
		.get();

	if (overlap.readingKeys.length) {
		const supersede = client.prepare(
			'update reading set superseded_by = ? where revision_id = ? and point = ? and kind = ? and superseded_by is null'
		);
		for (const key of overlap.readingKeys) {
			supersede.run(
				upload.id,
				revisionId,
				Math.floor(key / READING_KINDS.length),
				READING_KINDS[key % READING_KINDS.length]
			);
		}
	}
	if (overlap.runs.length) {
		tx.update(runCondition)
			.set({ supersededBy: upload.id })
			.where(
				and(
					eq(runCondition.revisionId, revisionId),
					isNull(runCondition.supersededBy),
					inArray(runCondition.run, overlap.runs)
				)
			)
			.run();
	}
	const newConditions = checked.conditions.filter((x) => !overlap.agreeingRuns.has(x.run));
	if (newConditions.length)
		tx.insert(runCondition)
			.values(newConditions.map((x) => ({ ...x, revisionId, uploadId: upload.id })))
			.run();

	const insert = client.prepare(
		`insert into reading (revision_id, upload_id, point, run, kind, pressure_pa, value, unit, inclination_deg, fluid_density_kgm3, measured_at, note)
		 values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`
	);
	for (const r of checked.readings) {
		insert.run(
			revisionId,
			upload.id,
			r.point,
			r.run,
			r.kind,
			r.pressure_Pa,
			r.value,
			r.unit,
			r.inclination_deg,
			r.fluidDensity_kgm3,
			r.measuredAt?.getTime() ?? null,
			r.note
		);
	}

	const runCount = checked.conditions.length;
	const described = `“${file.fileName}”: ${checked.readings.length} readings in ${runCount} run(s), SHA-256 ${file.sha256.slice(0, 12)}…`;
	tx.insert(auditEvent)
		.values({
			campaignId: c.id,
			actorId: viewer.id,
			actorName,
			action:
				overlap.readingKeys.length || overlap.runs.length ? 'replace-readings' : 'upload-readings',
			fromState: c.state,
			toState: c.state,
			notes:
				overlap.readingKeys.length || overlap.runs.length
					? `${described}; replaced ${overlap.readingKeys.length} reading(s) of ${overlap.points.length} point(s)${overlap.readingKeys.length ? ` — ${replacedFrom(tx, upload.id)}` : ''}${overlap.runs.length ? `; new reference conditions for run(s) ${overlap.runs.join(', ')}` : ''}`
					: described
		})
		.run();
	return {
		ok: true,
		id: upload.id,
		fileName: file.fileName,
		sha256: file.sha256,
		readingCount: checked.readings.length,
		runCount,
		replacedCount: overlap.readingKeys.length
	};
}

/**
 * Takes a readings file for a campaign's approved revision: all or nothing. Readings that would
 * replace stored ones are refused unless `replace` is set; replaced readings are kept, marked
 * with the upload that replaced them, and the audit trail says who replaced what. The original
 * bytes are kept in `store` with their SHA-256.
 */
export async function receiveReadings(
	db: Db,
	store: BlobStore,
	viewer: SessionUser,
	campaignId: string,
	file: ReadingsFile,
	{ replace = false, progress = () => {} }: { replace?: boolean; progress?: ReceiveProgress } = {}
): Promise<ReceiveOutcome> {
	const c = db.select().from(campaign).where(eq(campaign.id, campaignId)).get();
	if (!c || !canReadCampaign(viewer, c)) return refuse('not-found', 'No such campaign.');
	if (!canUploadReadings(viewer, c))
		return refuse(
			'forbidden',
			'Readings are sent by the campaign’s team, tunnel operators and administrators.'
		);
	if (!c.approvedRevisionId)
		return refuse(
			'conflict',
			'The campaign has no approved revision yet; readings attach to the approved matrix.'
		);
	const approved = approvedLayout(db, c.approvedRevisionId);
	if (!approved.ok) return approved;

	progress('parse', 0, file.bytes.length);
	const table =
		file.mediaType === 'application/json'
			? readJsonReadings(file.bytes)
			: await readCsv(file.bytes);
	if (!table.ok)
		return {
			...refuse('invalid', table.problems[0]!.reason),
			problems: table.problems,
			problemCount: table.problems.length
		};
	progress('parse', file.bytes.length, file.bytes.length);

	const checked = await checkReadings(table.table, approved.plan, approved.layout, (done, total) =>
		progress('check', done, total)
	);
	if (!checked.ok)
		return {
			...refuse('invalid', `The file has ${checked.problemCount} problem(s); nothing was stored.`),
			problems: checked.problems,
			problemCount: checked.problemCount
		};

	progress('store', 0, checked.readings.length);
	const sha256 = createHash('sha256').update(file.bytes).digest('hex');
	const storageKey = await store.put(file.bytes);
	try {
		const outcome = db.transaction(
			(tx) =>
				storeReadings(
					tx,
					db.$client,
					viewer,
					c,
					c.approvedRevisionId!,
					{ ...file, sha256, storageKey },
					checked,
					replace
				),
			{ behavior: 'immediate' }
		);
		if (!outcome.ok) await store.remove(storageKey);
		else progress('store', checked.readings.length, checked.readings.length);
		return outcome;
	} catch (error) {
		await store.remove(storageKey);
		throw error;
	}
}
