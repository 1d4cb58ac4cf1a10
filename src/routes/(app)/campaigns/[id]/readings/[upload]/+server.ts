import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import { readingsUploadFor } from '$lib/server/readings';
import { storedFileResponse } from '$lib/server/storage';
import type { RequestHandler } from './$types';

/** The original bytes of a readings file, as received, for provenance. */
export const GET: RequestHandler = async ({ locals, params }) => {
	const user = requireUser(locals);
	const upload = readingsUploadFor(locals.db, user, params.id, params.upload);
	if (!upload) error(404, { message: 'No such readings file.' });
	const name = upload.fileName.replace(/["\\\r\n]/g, '_');
	return storedFileResponse(locals.files, upload, {
		'content-type': `${upload.mediaType}; charset=utf-8`,
		'content-disposition': `attachment; filename="${name}"; filename*=UTF-8''${encodeURIComponent(upload.fileName)}`,
		'x-checksum-sha256': upload.sha256
	});
};
