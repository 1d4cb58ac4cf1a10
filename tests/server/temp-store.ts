import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buffer } from 'node:stream/consumers';
import { afterAll, beforeAll } from 'vitest';
import type { FileRecord, ObjectStore } from '../../src/lib/server/storage/object-store';
import { openObjectStore, type OpenedStore } from '../../src/lib/server/storage/open';

let dir: string | undefined;
let opened: OpenedStore | undefined;

// One local S3 fake per test file, in a temporary folder, closed and removed after the file.
beforeAll(async () => {
	dir = mkdtempSync(join(tmpdir(), 'tunnelwright-objects-'));
	opened = await openObjectStore({ LOCAL_S3_DIR: dir }, () => {});
});

afterAll(async () => {
	await opened?.close();
	if (dir) rmSync(dir, { recursive: true, force: true });
});

/** The test file's object store: the local S3 fake, reached over HTTP like a real bucket. */
export function tempStore(): ObjectStore {
	if (!opened) throw new Error('The temporary object store is opened in beforeAll.');
	return opened.store;
}

/** A stored file read to its end, through the store's checksum check. */
export async function readStored(file: FileRecord): Promise<Uint8Array> {
	const body = await tempStore().open(file);
	if (!body) throw new Error(`No stored file ${file.storageKey}`);
	return new Uint8Array(await buffer(body));
}
