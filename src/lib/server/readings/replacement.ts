import { and, eq, inArray, sql } from 'drizzle-orm';
import { READING_KINDS, type ReadingKind } from '../../schemas/readings';
import type { Db, Tx } from '../db/open';
import { reading, readingsUpload, runCondition } from '../db/schema';
import { refuse } from '../outcome';
import type { CheckedReading, RunConditions } from './check';
import { currentCondition, currentConditions, currentReading } from './current';
import type { ReadingsRefusal } from './receive';
import { conditionsAgree } from './run-conditions';

/** What a checked file would replace of a revision's current readings and conditions. */
export type Replacement = {
	/** Current readings the file would replace, as `point * kinds + kind`. */
	readingKeys: number[];
	points: number[];
	/** Runs whose stored reference conditions differ from the file's. */
	runs: number[];
	/** Runs whose stored conditions agree with the file's, kept as they are. */
	agreeingRuns: Set<number>;
};

/** Names a point's reading of one kind by one number, so a file's worth fits in a Set. */
const readingKey = (point: number, kind: string) =>
	point * READING_KINDS.length + READING_KINDS.indexOf(kind as ReadingKind);

export function findReplacement(
	tx: Tx,
	revisionId: string,
	readings: CheckedReading[],
	conditions: RunConditions[]
): Replacement {
	const stored = new Set(
		tx
			.select({ point: reading.point, kind: reading.kind })
			.from(reading)
			.where(currentReading(revisionId))
			.all()
			.map((r) => readingKey(r.point, r.kind))
	);
	const readingKeys: number[] = [];
	const points = new Set<number>();
	for (const r of readings) {
		const key = readingKey(r.point, r.kind);
		if (stored.has(key)) {
			readingKeys.push(key);
			points.add(r.point);
		}
	}
	const storedConditions = new Map(currentConditions(tx, revisionId).map((c) => [c.run, c]));
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

export const replacesAnything = (r: Replacement) => r.readingKeys.length > 0 || r.runs.length > 0;

const MAX_POINTS_NAMED = 100;

/** Why a file that would replace stored readings was refused without `replace`. */
export function replacementConflict(r: Replacement): ReadingsRefusal {
	const parts = [];
	if (r.points.length)
		parts.push(`${r.points.length} point(s) already have readings of the same kind`);
	if (r.runs.length)
		parts.push(
			`${r.runs.length} run(s) already have other reference conditions (runs ${r.runs.slice(0, 20).join(', ')})`
		);
	return {
		...refuse(
			'conflict',
			`${parts.join(' and ')}. Nothing was stored; confirm replacing them (replace=true) to store this file.`
		),
		points: r.points.slice(0, MAX_POINTS_NAMED),
		pointCount: r.points.length,
		runs: r.runs
	};
}

/**
 * Marks what the upload replaces with the upload's id; nothing is deleted. `client` is the
 * connection `tx` runs on: its prepared statement takes part in the transaction.
 */
export function supersede(
	tx: Tx,
	client: Db['$client'],
	revisionId: string,
	uploadId: string,
	r: Replacement
) {
	if (r.readingKeys.length) {
		const mark = client.prepare(
			'update reading set superseded_by = ? where revision_id = ? and point = ? and kind = ? and superseded_by is null'
		);
		for (const key of r.readingKeys)
			mark.run(
				uploadId,
				revisionId,
				Math.floor(key / READING_KINDS.length),
				READING_KINDS[key % READING_KINDS.length]
			);
	}
	if (r.runs.length)
		tx.update(runCondition)
			.set({ supersededBy: uploadId })
			.where(and(currentCondition(revisionId), inArray(runCondition.run, r.runs)))
			.run();
}

/** The audit trail's words for a replacement: how much, from which files, which runs' conditions. */
export function replacementNote(tx: Tx, uploadId: string, r: Replacement): string {
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
		.all()
		.map(
			(s) =>
				`${s.n} from “${s.fileName}” (${s.by}, ${s.at.toISOString().slice(0, 16).replace('T', ' ')} UTC)`
		)
		.join('; ');
	return (
		`replaced ${r.readingKeys.length} reading(s) of ${r.points.length} point(s)` +
		(r.readingKeys.length ? ` — ${sources}` : '') +
		(r.runs.length ? `; new reference conditions for run(s) ${r.runs.join(', ')}` : '')
	);
}
