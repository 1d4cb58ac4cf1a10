import { HeadBucketCommand } from '@aws-sdk/client-s3';
import { startFakeS3 } from './fake-s3';
import { s3ObjectStore, type ObjectStore } from './object-store';
import { s3Client, s3SettingsFromUrl } from './s3-url';

export type OpenedStore = { store: ObjectStore; close(): Promise<void> };

type Env = Record<string, string | undefined>;

/** Where the local fake keeps its objects when `S3_URL` is unset. */
export function localS3DirFromEnv(env: Env): string {
	return env.LOCAL_S3_DIR?.trim() || 'data/object-store';
}

/** Where files were kept on disk before they moved to the object store. */
export function attachmentsDirFromEnv(env: Env): string {
	return env.ATTACHMENTS_DIR?.trim() || 'data/attachments';
}

/**
 * Opens the bucket `S3_URL` names or, without one, starts the local fake over
 * `LOCAL_S3_DIR`. Either way the bucket is reached once here, so a wrong endpoint, key or
 * bucket stops the start instead of the first upload.
 */
export async function openObjectStore(
	env: Env,
	log: (line: string) => void = console.log
): Promise<OpenedStore> {
	const url = env.S3_URL?.trim();
	const fake = url ? undefined : await startFakeS3(localS3DirFromEnv(env));
	const settings = fake?.settings ?? s3SettingsFromUrl(url!);
	const client = s3Client(settings);
	try {
		await client.send(new HeadBucketCommand({ Bucket: settings.bucket }));
	} catch (error) {
		client.destroy();
		await fake?.close();
		throw new Error(`The object store's bucket ${settings.bucket} cannot be reached`, {
			cause: error
		});
	}
	if (fake)
		log(
			`Files: S3_URL is not set; files are kept by a local S3 store on ${settings.endpoint} in ${localS3DirFromEnv(env)}.`
		);
	return {
		store: s3ObjectStore(client, settings.bucket),
		close: async () => {
			client.destroy();
			await fake?.close();
		}
	};
}
