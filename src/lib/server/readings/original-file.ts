import type { ObjectStore, StoredFile } from '../storage/object-store';

/** A received file's bytes as kept for provenance: where they are and their SHA-256. */
export type KeptOriginal = Pick<StoredFile, 'sha256' | 'storageKey'>;

/**
 * Keeps the bytes exactly as received, before anything is stored in the database, so that
 * every stored reading can be traced to the file it came from.
 */
export async function keepOriginal(store: ObjectStore, bytes: Uint8Array): Promise<KeptOriginal> {
	const { sha256, storageKey } = await store.put(bytes);
	return { sha256, storageKey };
}

/** Drops the kept bytes of a file whose readings were not stored after all. */
export const discardOriginal = (store: ObjectStore, kept: KeptOriginal) =>
	store.remove(kept.storageKey);
