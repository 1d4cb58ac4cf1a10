import { and, asc, desc, eq, isNull } from 'drizzle-orm';
import type { ReceivedFile } from '../../readings/types';
import type { DbOrTx } from '../db/open';
import { reading, readingsUpload, runCondition } from '../db/schema';

/**
 * What a revision holds now. Replaced readings and conditions stay in their tables, marked with
 * the upload that replaced them, so "current" means not superseded.
 */
export const currentReading = (revisionId: string) =>
	and(eq(reading.revisionId, revisionId), isNull(reading.supersededBy));

export const currentCondition = (revisionId: string) =>
	and(eq(runCondition.revisionId, revisionId), isNull(runCondition.supersededBy));

/** The current readings of a revision in point order, a page at a time. */
export function currentReadings(db: DbOrTx, revisionId: string, offset: number, limit: number) {
	return db
		.select({
			point: reading.point,
			run: reading.run,
			kind: reading.kind,
			pressure_Pa: reading.pressure_Pa,
			value: reading.value,
			unit: reading.unit,
			inclination_deg: reading.inclination_deg,
			fluidDensity_kgm3: reading.fluidDensity_kgm3,
			measuredAt: reading.measuredAt,
			note: reading.note,
			uploadId: reading.uploadId
		})
		.from(reading)
		.where(currentReading(revisionId))
		.orderBy(asc(reading.point), asc(reading.kind))
		.limit(limit)
		.offset(offset)
		.all();
}

/** The current reference conditions of a revision's runs. */
export function currentConditions(db: DbOrTx, revisionId: string) {
	return db
		.select({
			run: runCondition.run,
			referenceDynamicPressure_Pa: runCondition.referenceDynamicPressure_Pa,
			airTemperature_K: runCondition.airTemperature_K,
			barometricPressure_Pa: runCondition.barometricPressure_Pa,
			relativeHumidity: runCondition.relativeHumidity,
			uploadId: runCondition.uploadId
		})
		.from(runCondition)
		.where(currentCondition(revisionId))
		.orderBy(asc(runCondition.run))
		.all();
}

/** Every readings file a campaign received, newest first, without the storage key. */
export function receivedFiles(db: DbOrTx, campaignId: string): ReceivedFile[] {
	return db
		.select({
			id: readingsUpload.id,
			fileName: readingsUpload.fileName,
			mediaType: readingsUpload.mediaType,
			size_bytes: readingsUpload.size_bytes,
			sha256: readingsUpload.sha256,
			channel: readingsUpload.channel,
			uploaderName: readingsUpload.uploaderName,
			readingCount: readingsUpload.readingCount,
			runCount: readingsUpload.runCount,
			replacedCount: readingsUpload.replacedCount,
			createdAt: readingsUpload.createdAt
		})
		.from(readingsUpload)
		.where(eq(readingsUpload.campaignId, campaignId))
		.orderBy(desc(readingsUpload.createdAt))
		.all();
}
