import { randomBytes } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';

/**
 * Attachment bytes on the server's disk, outside static/, under random names. The folder is
 * ATTACHMENTS_DIR (default data/attachments); files are served only through routes that check
 * access.
 */
export type BlobStore = {
	put(bytes: Uint8Array): Promise<string>;
	get(key: string): Promise<Uint8Array>;
	remove(key: string): Promise<void>;
};

export function attachmentsDirFromEnv(env: Record<string, string | undefined>): string {
	return env.ATTACHMENTS_DIR?.trim() || 'data/attachments';
}

const KEY = /^[a-f0-9]{32}$/;

export function diskBlobStore(folder: string): BlobStore {
	const root = resolve(folder);
	const pathOf = (key: string) => {
		if (!KEY.test(key)) throw new Error('Malformed storage key');
		return join(root, key.slice(0, 2), key);
	};
	return {
		async put(bytes) {
			const key = randomBytes(16).toString('hex');
			await mkdir(join(root, key.slice(0, 2)), { recursive: true });
			await writeFile(pathOf(key), bytes, { flag: 'wx' });
			return key;
		},
		async get(key) {
			return new Uint8Array(await readFile(pathOf(key)));
		},
		async remove(key) {
			await rm(pathOf(key), { force: true });
		}
	};
}
