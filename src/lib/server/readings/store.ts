import type { UploadSummary } from '../../readings/types';
import type { SessionUser } from '../../roles';
import type { Db, Tx } from '../db/open';
import { campaign, readingsUpload, runCondition } from '../db/schema';
import { recordCampaignEvent } from '../review/audit';
import type { CheckedReading, RunConditions } from './check';
import type { KeptOriginal } from './original-file';
import type { ReadingsFile, ReadingsRefusal } from './receive';
import {
	findReplacement,
	replacementConflict,
	replacementNote,
	replacesAnything,
	supersede
} from './replacement';

export type StoreOutcome = ({ ok: true } & UploadSummary) | ReadingsRefusal;

/**
 * The body of the receiving transaction: the upload's record, what it replaces marked as
 * replaced, its run conditions and readings, and the audit event. Refuses, storing nothing,
 * when it would replace stored readings and `replace` is not set. `client` is the connection
 * `tx` runs on: its prepared statements take part in the transaction.
 */
export function storeReadings(
	tx: Tx,
	client: Db['$client'],
	viewer: SessionUser,
	c: typeof campaign.$inferSelect,
	revisionId: string,
	file: ReadingsFile & KeptOriginal,
	checked: { readings: CheckedReading[]; conditions: RunConditions[] },
	replace: boolean
): StoreOutcome {
	const replacement = findReplacement(tx, revisionId, checked.readings, checked.conditions);
	if (!replace && (replacement.points.length || replacement.runs.length))
		return replacementConflict(replacement);

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
			replacedCount: replacement.readingKeys.length
		})
		.returning({ id: readingsUpload.id })
		.get();

	supersede(tx, client, revisionId, upload.id, replacement);
	const newConditions = checked.conditions.filter((x) => !replacement.agreeingRuns.has(x.run));
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
	const replaced = replacesAnything(replacement);
	recordCampaignEvent(
		tx,
		c,
		{ id: viewer.id, name: actorName },
		replaced ? 'replace-readings' : 'upload-readings',
		replaced ? `${described}; ${replacementNote(tx, upload.id, replacement)}` : described
	);
	return {
		ok: true,
		id: upload.id,
		fileName: file.fileName,
		sha256: file.sha256,
		readingCount: checked.readings.length,
		runCount,
		replacedCount: replacement.readingKeys.length
	};
}
