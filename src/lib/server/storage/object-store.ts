import {
	DeleteObjectCommand,
	GetObjectCommand,
	HeadObjectCommand,
	NoSuchKey,
	NotFound,
	PutObjectCommand,
	type S3Client
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { randomBytes } from 'node:crypto';
import { pipeline, Readable } from 'node:stream';
import { hashing, sha256Of, verifying } from './integrity';

/** A file as the database records it: where it is, its length and its SHA-256. */
export type StoredFile = { storageKey: string; size_bytes: number; sha256: string };

/** A stored file to read back; files kept before checksums were recorded have none. */
export type FileRecord = Omit<StoredFile, 'sha256'> & { sha256: string | null };

/**
 * Model attachments and original readings files, in an S3 bucket under random, unguessable
 * keys. Nothing in the bucket is ever handed out by URL: files reach users only through routes
 * that check access first and then stream the file from here.
 */
export type ObjectStore = {
	/** Stores a file under a fresh key, or under `storageKey` when moving a file in. */
	put(body: Uint8Array | Readable, storageKey?: string): Promise<StoredFile>;
	/** The file as a stream that fails rather than end on bytes that do not match the record. */
	open(file: FileRecord): Promise<Readable | undefined>;
	/** The stored length, or undefined when there is no such file. */
	sizeOf(storageKey: string): Promise<number | undefined>;
	remove(storageKey: string): Promise<void>;
};

const KEY = /^[a-f0-9]{32}$/;

function checkedKey(key: string): string {
	if (!KEY.test(key)) throw new Error('Malformed storage key');
	return key;
}

/**
 * Signs a PUT with the SHA-256 already computed for the database. The request signer would
 * otherwise hash the whole body a second time, and S3 refuses a body that does not match the
 * signed hash, so the file is checked on its way in as well.
 */
const signedWithSha256 =
	(sha256: string) =>
	<Args extends { request: unknown }, Output>(next: (args: Args) => Promise<Output>) =>
	(args: Args) => {
		const { headers } = args.request as { headers?: Record<string, string> };
		if (headers) headers['x-amz-content-sha256'] = sha256;
		return next(args);
	};

const missing = (error: unknown) => error instanceof NoSuchKey || error instanceof NotFound;

export function s3ObjectStore(client: S3Client, bucket: string): ObjectStore {
	const at = (key: string) => ({ Bucket: bucket, Key: checkedKey(key) });
	return {
		async put(body, storageKey = randomBytes(16).toString('hex')) {
			if (body instanceof Uint8Array) {
				const sha256 = sha256Of(body);
				const command = new PutObjectCommand({
					...at(storageKey),
					Body: body,
					ContentLength: body.byteLength
				});
				command.middlewareStack.add(signedWithSha256(sha256), { step: 'build' });
				await client.send(command);
				return { storageKey, size_bytes: body.byteLength, sha256 };
			}
			// A stream's length is known only at its end: lib-storage sends it in parts as it comes.
			// A failing source fails the upload, so pipeline's own callback has nothing to add.
			const counted = hashing();
			const upload = new Upload({
				client,
				params: { ...at(storageKey), Body: pipeline(body, counted.stream, () => {}) }
			});
			await upload.done();
			return { storageKey, size_bytes: counted.size_bytes(), sha256: counted.sha256() };
		},
		async open(file) {
			try {
				const { Body } = await client.send(new GetObjectCommand(at(file.storageKey)));
				if (!(Body instanceof Readable)) throw new Error('The object store sent no stream.');
				// Any failure, the checksum's included, reaches the reader as the stream's error.
				return pipeline(Body, verifying(file, file.storageKey), () => {});
			} catch (error) {
				if (missing(error)) return undefined;
				throw error;
			}
		},
		async sizeOf(storageKey) {
			try {
				const head = await client.send(new HeadObjectCommand(at(storageKey)));
				return head.ContentLength;
			} catch (error) {
				if (missing(error)) return undefined;
				throw error;
			}
		},
		async remove(storageKey) {
			await client.send(new DeleteObjectCommand(at(storageKey)));
		}
	};
}
