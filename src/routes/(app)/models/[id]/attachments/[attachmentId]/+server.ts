import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/guards';
import { getAttachmentFor } from '$lib/server/models';
import { storedFileResponse } from '$lib/server/storage';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist', 'admin');
	const attachment = getAttachmentFor(locals.db, user, params.attachmentId);
	if (!attachment || attachment.modelId !== params.id)
		error(404, { message: 'No such attachment.' });
	return storedFileResponse(locals.files, attachment, {
		'content-type': attachment.mediaType,
		'content-disposition': `inline; filename*=UTF-8''${encodeURIComponent(attachment.fileName)}`,
		// An SVG can carry script: keep anything it holds from running.
		'content-security-policy':
			"default-src 'none'; style-src 'unsafe-inline'; img-src data:; sandbox",
		'cache-control': 'private, max-age=3600'
	});
};
