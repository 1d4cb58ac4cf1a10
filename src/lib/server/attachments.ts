import { env } from '$env/dynamic/private';
import { attachmentsDirFromEnv, diskBlobStore, type BlobStore } from './storage';

let store: BlobStore | undefined;

/** The app's attachment store, in ATTACHMENTS_DIR (default data/attachments). */
export function attachmentStore(): BlobStore {
	store ??= diskBlobStore(attachmentsDirFromEnv(env));
	return store;
}
