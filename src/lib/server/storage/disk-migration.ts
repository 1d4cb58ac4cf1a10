import { eq } from 'drizzle-orm';
import { createReadStream, existsSync } from 'node:fs';
import { readdir } from 'node:fs/promises';
import { basename, join, resolve } from 'node:path';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Db } from '../db/open';
import { modelAttachment, readingsUpload } from '../db/schema';
import { hashing } from './integrity';
import type { FileRecord, ObjectStore } from './object-store';

export type DiskMigrationCounts = {
	/** Copied from disk and read back intact. */
	copied: number;
	/** In the store already with the recorded length: left as they are. */
	present: number;
	/** Recorded in the database but neither on disk nor in the store. */
	missing: number;
	/** On disk, but not with the recorded length or SHA-256: not copied. */
	damaged: number;
	/** On disk with no record pointing at them (left behind by an interrupted upload). */
	unreferenced: number;
};

type Recorded = FileRecord & { attachment: boolean };

function recordedFiles(db: Db): Recorded[] {
	const attachments = db
		.select({
			storageKey: modelAttachment.storageKey,
			size_bytes: modelAttachment.size_bytes,
			sha256: modelAttachment.sha256
		})
		.from(modelAttachment)
		.all()
		.map((a) => ({ ...a, attachment: true }));
	const originals = db
		.select({
			storageKey: readingsUpload.storageKey,
			size_bytes: readingsUpload.size_bytes,
			sha256: readingsUpload.sha256
		})
		.from(readingsUpload)
		.all()
		.map((u) => ({ ...u, attachment: false }));
	return [...attachments, ...originals];
}

/** The keys of files in the disk layout the app used before: `<folder>/<first two>/<key>`. */
async function keysOnDisk(folder: string): Promise<string[]> {
	if (!existsSync(folder)) return [];
	const paths = await readdir(folder, { recursive: true });
	return paths
		.map((p) => ({ key: basename(p), path: p }))
		.filter(({ key, path }) => /^[a-f0-9]{32}$/.test(key) && path === join(key.slice(0, 2), key))
		.map(({ key }) => key);
}

/**
 * Reads a stored file to its end through its checksum check; its SHA-256, or undefined when it
 * is missing or fails the check.
 */
async function digestOf(store: ObjectStore, file: FileRecord): Promise<string | undefined> {
	const body = await store.open(file);
	if (!body) return undefined;
	const counted = hashing();
	return pipeline(
		body,
		counted.stream,
		new Writable({ write: (_chunk, _encoding, done) => done() })
	).then(
		() => counted.sha256(),
		() => undefined
	);
}

/** Fills in the checksum of an attachment kept before checksums were recorded. */
function recordChecksum(db: Db, record: Recorded, sha256: string | undefined) {
	if (!record.attachment || sha256 === undefined) return;
	db.update(modelAttachment)
		.set({ sha256 })
		.where(eq(modelAttachment.storageKey, record.storageKey))
		.run();
}

/**
 * Moves the files the database records from the old disk folder into the object store, under
 * the same keys so every row stays valid. Each copy is read back and checked against the
 * recorded length and SHA-256; attachments recorded before checksums were kept get theirs
 * filled in from the copy. A second run skips what is in the store already, since an S3 write
 * is all or nothing. The disk folder is only read.
 */
export async function moveDiskFiles(
	db: Db,
	store: ObjectStore,
	diskFolder: string
): Promise<DiskMigrationCounts> {
	const folder = resolve(diskFolder);
	const counts: DiskMigrationCounts = {
		copied: 0,
		present: 0,
		missing: 0,
		damaged: 0,
		unreferenced: 0
	};
	const records = recordedFiles(db);
	const recordedKeys = new Set(records.map((r) => r.storageKey));
	counts.unreferenced = (await keysOnDisk(folder)).filter((k) => !recordedKeys.has(k)).length;

	for (const record of records) {
		const inStore = (await store.sizeOf(record.storageKey)) === record.size_bytes;
		if (inStore) {
			if (record.sha256 === null) recordChecksum(db, record, await digestOf(store, record));
			counts.present++;
			continue;
		}
		const path = join(folder, record.storageKey.slice(0, 2), record.storageKey);
		if (!existsSync(path)) {
			counts.missing++;
			continue;
		}
		const copy = await store.put(createReadStream(path), record.storageKey);
		const intact =
			copy.size_bytes === record.size_bytes &&
			(record.sha256 === null || copy.sha256 === record.sha256) &&
			(await digestOf(store, copy)) === copy.sha256;
		if (!intact) {
			await store.remove(record.storageKey);
			counts.damaged++;
			continue;
		}
		if (record.sha256 === null) recordChecksum(db, record, copy.sha256);
		counts.copied++;
	}
	return counts;
}
