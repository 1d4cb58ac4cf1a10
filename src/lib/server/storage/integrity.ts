import { createHash } from 'node:crypto';
import { Transform } from 'node:stream';

export const sha256Of = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Counts and hashes what flows through; `sha256()` is the digest once the stream has ended. */
export function hashing() {
	const hash = createHash('sha256');
	let size_bytes = 0;
	const stream = new Transform({
		transform(chunk: Buffer, _encoding, done) {
			hash.update(chunk);
			size_bytes += chunk.byteLength;
			done(null, chunk);
		}
	});
	return { stream, sha256: () => hash.digest('hex'), size_bytes: () => size_bytes };
}

export class IntegrityError extends Error {}

/**
 * Passes a stored file through while checking it against what was recorded when it was stored.
 * The last chunk is held back until the check has passed: a reader told the file's length
 * would otherwise receive every byte of a damaged file and take it as complete.
 */
export function verifying(expected: { size_bytes: number; sha256: string | null }, key: string) {
	const hash = createHash('sha256');
	let size_bytes = 0;
	let held: Buffer | undefined;
	return new Transform({
		transform(chunk: Buffer, _encoding, done) {
			hash.update(chunk);
			size_bytes += chunk.byteLength;
			const previous = held;
			held = chunk;
			done(null, previous);
		},
		flush(done) {
			const sha256 = hash.digest('hex');
			if (size_bytes !== expected.size_bytes)
				return done(
					new IntegrityError(
						`Stored file ${key} has ${size_bytes} bytes, ${expected.size_bytes} were recorded.`
					)
				);
			if (expected.sha256 !== null && sha256 !== expected.sha256)
				return done(new IntegrityError(`Stored file ${key} does not match its SHA-256.`));
			done(null, held);
		}
	});
}
