import { Readable } from 'node:stream';
import { buffer } from 'node:stream/consumers';
import { describe, expect, it } from 'vitest';
import { IntegrityError } from '../../src/lib/server/storage/integrity';
import { readStored, tempStore } from './temp-store';

const text = (s: string) => new TextEncoder().encode(s);

/** What a reader receives of a stored file before the stream ends or breaks off. */
async function received(stream: Readable) {
	let bytes = 0;
	try {
		for await (const chunk of stream) bytes += (chunk as Buffer).byteLength;
		return { bytes, error: undefined };
	} catch (error) {
		return { bytes, error };
	}
}

describe('the object store on the local S3 fake', () => {
	it('keeps bytes in hand under a fresh key with their SHA-256, and removes them', async () => {
		const store = tempStore();
		const kept = await store.put(text('abc'));
		// FIPS 180-2, appendix B.1: SHA-256("abc").
		expect(kept.sha256).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
		expect(kept.storageKey).toMatch(/^[0-9a-f]{32}$/);
		expect(kept.size_bytes).toBe(3);
		expect(await store.sizeOf(kept.storageKey)).toBe(3);
		expect(await readStored(kept)).toEqual(text('abc'));
		expect((await store.put(text('abc'))).storageKey).not.toBe(kept.storageKey);

		await store.remove(kept.storageKey);
		expect(await store.open(kept)).toBeUndefined();
		expect(await store.sizeOf(kept.storageKey)).toBeUndefined();
	});

	it('takes a stream of unknown length and hashes it as it passes', async () => {
		const store = tempStore();
		const chunk = Buffer.alloc(100_000, 'a');
		const kept = await store.put(Readable.from(Array.from({ length: 10 }, () => chunk)));
		// FIPS 180-2, appendix B.3: SHA-256 of one million repetitions of "a".
		expect(kept.sha256).toBe('cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0');
		expect(kept.size_bytes).toBe(1_000_000);
		const back = await store.open(kept);
		expect((await buffer(back!)).equals(Buffer.alloc(1_000_000, 'a'))).toBe(true);
	});

	it('sends a stream larger than one part in parts and reads it back whole', async () => {
		const store = tempStore();
		// 11 MiB: more than two of lib-storage's 5 MiB parts.
		const parts = Array.from({ length: 11 }, (_, i) => Buffer.alloc(1024 * 1024, i));
		const kept = await store.put(Readable.from(parts));
		expect(kept.size_bytes).toBe(11 * 1024 * 1024);
		expect(await store.sizeOf(kept.storageKey)).toBe(11 * 1024 * 1024);
		expect((await buffer((await store.open(kept))!)).equals(Buffer.concat(parts))).toBe(true);
	});

	it('breaks off a file whose bytes no longer match its record before the last of them', async () => {
		const store = tempStore();
		// FIPS 180-2, appendix B.2: the two-block message.
		const message = 'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq';
		const kept = await store.put(text(message));
		expect(kept.sha256).toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');

		await store.put(text(message.toUpperCase()), kept.storageKey);
		const sameLength = await received((await store.open(kept))!);
		expect(sameLength.error).toBeInstanceOf(IntegrityError);
		expect(sameLength.bytes).toBeLessThan(kept.size_bytes);

		await store.put(text(message.slice(1)), kept.storageKey);
		const shorter = await received((await store.open(kept))!);
		expect(shorter.error).toBeInstanceOf(IntegrityError);
		expect(String(shorter.error)).toMatch(/55 bytes, 56 were recorded/);
	});

	it('checks the length alone of a file recorded without a checksum', async () => {
		const store = tempStore();
		const kept = await store.put(text('abc'));
		expect(await readStored({ ...kept, sha256: null })).toEqual(text('abc'));
		const wrong = await received((await store.open({ ...kept, sha256: null, size_bytes: 4 }))!);
		expect(wrong.error).toBeInstanceOf(IntegrityError);
	});

	it('refuses keys that are not its own', async () => {
		const store = tempStore();
		await expect(store.put(text('x'), '../outside')).rejects.toThrow(/Malformed storage key/);
		await expect(
			store.open({ storageKey: 'ab/../cd', size_bytes: 1, sha256: null })
		).rejects.toThrow(/Malformed storage key/);
	});
});
