import { createHash } from 'node:crypto';
import type { BlobStore } from '../storage';

/** A received file's bytes as kept for provenance: where they are and their SHA-256. */
export type KeptOriginal = { sha256: string; storageKey: string };

/**
 * Keeps the bytes exactly as received, before anything is stored in the database, so that
 * every stored reading can be traced to the file it came from.
 */
export async function keepOriginal(store: BlobStore, bytes: Uint8Array): Promise<KeptOriginal> {
	const sha256 = createHash('sha256').update(bytes).digest('hex');
	return { sha256, storageKey: await store.put(bytes) };
}

/** Drops the kept bytes of a file whose readings were not stored after all. */
export const discardOriginal = (store: BlobStore, kept: KeptOriginal) =>
	store.remove(kept.storageKey);
