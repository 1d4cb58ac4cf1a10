import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { diskBlobStore } from '../storage';
import { discardOriginal, keepOriginal } from './original-file';

describe('the original file', () => {
	it('is kept byte for byte with its SHA-256, and can be dropped again', async () => {
		const store = diskBlobStore(mkdtempSync(join(tmpdir(), 'tunnelwright-originals-')));
		const bytes = new TextEncoder().encode('abc');
		const kept = await keepOriginal(store, bytes);
		// FIPS 180-2, appendix B.1: SHA-256("abc").
		expect(kept.sha256).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
		expect(new Uint8Array(await store.get(kept.storageKey))).toEqual(bytes);
		await discardOriginal(store, kept);
		await expect(store.get(kept.storageKey)).rejects.toThrow();
	});
});
