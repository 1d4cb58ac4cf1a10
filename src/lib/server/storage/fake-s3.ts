import { mkdir } from 'node:fs/promises';
import { resolve } from 'node:path';
import S3rver from 's3rver';
import type { S3Settings } from './s3-url';

export type FakeS3 = { settings: S3Settings; close(): Promise<void> };

/** s3rver signs requests with these fixed keys; it listens on loopback only. */
const FAKE_KEYS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

/**
 * An S3-compatible store for demos and tests: s3rver on loopback at a free port, keeping its
 * objects as files under `directory`, so they outlive the process like a real bucket's.
 */
export async function startFakeS3(directory: string, bucket = 'tunnelwright'): Promise<FakeS3> {
	const folder = resolve(directory);
	await mkdir(folder, { recursive: true });
	const fake = new S3rver({
		address: '127.0.0.1',
		port: 0,
		directory: folder,
		silent: true,
		configureBuckets: [{ name: bucket }]
	});
	const { port } = await fake.run();
	// adapter-node exits once its own server has closed; the fake must not hold it open.
	fake.httpServer.unref();
	return {
		settings: { endpoint: `http://127.0.0.1:${port}`, region: 'us-east-1', bucket, ...FAKE_KEYS },
		close: async () => {
			fake.httpServer.closeAllConnections();
			await fake.close();
		}
	};
}
