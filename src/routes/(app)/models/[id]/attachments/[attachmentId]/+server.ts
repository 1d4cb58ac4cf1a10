import { error } from '@sveltejs/kit';
import { attachmentStore } from '$lib/server/attachments';
import { requireRole } from '$lib/server/guards';
import { getAttachmentFor } from '$lib/server/models';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals, params }) => {
	const user = requireRole(locals, 'aerodynamicist', 'admin');
	const attachment = getAttachmentFor(locals.db, user, params.attachmentId);
	if (!attachment || attachment.modelId !== params.id)
		error(404, { message: 'No such attachment.' });
	const bytes = await attachmentStore().get(attachment.storageKey);
	return new Response(bytes as BodyInit, {
		headers: {
			'content-type': attachment.mediaType,
			'content-length': String(bytes.byteLength),
			'content-disposition': `inline; filename*=UTF-8''${encodeURIComponent(attachment.fileName)}`,
			// An SVG can carry script: keep anything it holds from running.
			'content-security-policy':
				"default-src 'none'; style-src 'unsafe-inline'; img-src data:; sandbox",
			'cache-control': 'private, max-age=3600'
		}
	});
};
