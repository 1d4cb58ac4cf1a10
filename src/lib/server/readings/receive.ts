import type { ReadingProblem, ReceivePhase, UploadSummary } from '../../readings/types';
import type { SessionUser } from '../../roles';
import { canUploadReadings } from '../access';
import { writeTransaction, type Db } from '../db/open';
import { refuse, type Refusal } from '../outcome';
import type { ObjectStore } from '../storage/object-store';
import { checkReadings } from './check';
import { readCsv, readJsonReadings } from './file';
import { approvedLayoutOf, readableCampaign } from './layout';
import { discardOriginal, keepOriginal } from './original-file';
import { storeReadings } from './store';

export type ReadingsFile = {
	fileName: string;
	mediaType: 'text/csv' | 'application/json';
	bytes: Uint8Array;
	channel: 'page' | 'api';
};

export type ReceiveProgress = (phase: ReceivePhase, done: number, total: number) => void;

/** Why nothing was stored: the refusal, with the file's problems or the points already read. */
export type ReadingsRefusal = Refusal & {
	problems?: ReadingProblem[];
	problemCount?: number;
	points?: number[];
	pointCount?: number;
	runs?: number[];
};

export type ReceiveOutcome = ({ ok: true } & UploadSummary) | ReadingsRefusal;

/**
 * Takes a readings file for a campaign's approved revision: all or nothing. Readings that would
 * replace stored ones are refused unless `replace` is set; replaced readings are kept, marked
 * with the upload that replaced them, and the audit trail says who replaced what. The original
 * bytes are kept in `store` with their SHA-256.
 */
export async function receiveReadings(
	db: Db,
	store: ObjectStore,
	viewer: SessionUser,
	campaignId: string,
	file: ReadingsFile,
	{ replace = false, progress = () => {} }: { replace?: boolean; progress?: ReceiveProgress } = {}
): Promise<ReceiveOutcome> {
	const found = readableCampaign(db, viewer, campaignId);
	if (!found.ok) return found;
	const c = found.campaign;
	if (!canUploadReadings(viewer, c))
		return refuse(
			'forbidden',
			'Readings are sent by the campaign’s team, tunnel operators and administrators.'
		);
	const approved = approvedLayoutOf(
		db,
		c,
		'The campaign has no approved revision yet; readings attach to the approved matrix.'
	);
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
	const kept = await keepOriginal(store, file.bytes);
	try {
		const outcome = writeTransaction(db, (tx) =>
			storeReadings(
				tx,
				db.$client,
				viewer,
				c,
				approved.revisionId,
				{ ...file, ...kept },
				checked,
				replace
			)
		);
		if (!outcome.ok) await discardOriginal(store, kept);
		else progress('store', checked.readings.length, checked.readings.length);
		return outcome;
	} catch (error) {
		await discardOriginal(store, kept);
		throw error;
	}
}
