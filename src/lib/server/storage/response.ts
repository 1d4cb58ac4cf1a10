import { error } from '@sveltejs/kit';
import { Readable } from 'node:stream';
import type { FileRecord, ObjectStore } from './object-store';

/**
 * Answers with a stored file streamed from the store as it comes, never buffered whole. The
 * caller has settled access already; a file that fails its checksum breaks off before its
 * last bytes, so no reader takes it as complete.
 */
export async function storedFileResponse(
	store: ObjectStore,
	file: FileRecord,
	headers: Record<string, string>
): Promise<Response> {
	const body = await store.open(file);
	if (!body) error(404, { message: 'The file is missing from the file store.' });
	return new Response(Readable.toWeb(body) as ReadableStream<Uint8Array>, {
		headers: { ...headers, 'content-length': String(file.size_bytes) }
	});
}
