import { env } from '$env/dynamic/private';
import type { ObjectStore } from './object-store';
import { openObjectStore } from './open';

export type { FileRecord, ObjectStore, StoredFile } from './object-store';
export { IntegrityError } from './integrity';

let starting: Promise<ObjectStore> | undefined;
let running: ObjectStore | undefined;

async function start(): Promise<ObjectStore> {
	const opened = await openObjectStore(env);
	// The client's open connections and the local fake would keep the process alive after
	// adapter-node has closed its server.
	process.once('sveltekit:shutdown', () => void opened.close());
	running = opened.store;
	return running;
}

/**
 * Opens the app's file store: the bucket of `S3_URL` or, without one, the local fake. Called
 * once at server start-up; later calls wait for the first.
 */
export async function startFileStore(): Promise<void> {
	starting ??= start();
	await starting;
}

/** The app's file store, for `locals.files`. */
export function fileStore(): ObjectStore {
	if (!running) throw new Error('The file store is not open: call startFileStore in hooks init.');
	return running;
}

export { storedFileResponse } from './response';
