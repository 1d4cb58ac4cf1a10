import { ATTACHMENT_MAX_BYTES } from '../schemas/model';
import { READINGS_MAX_BYTES } from '../schemas/readings';
import { MAX_REQUEST_BODY_BYTES } from './api';

/**
 * Routes that take files, with the largest body each accepts; the file's own limit is checked
 * again where it is read. Room is left for the multipart envelope.
 */
export const UPLOAD_LIMITS: ReadonlyMap<string, number> = new Map([
	['/(app)/models/[id]', ATTACHMENT_MAX_BYTES + 256 * 1024],
	['/(app)/campaigns/[id]', READINGS_MAX_BYTES + 256 * 1024],
	['/api/v1/campaigns/[id]/readings', READINGS_MAX_BYTES]
]);

/** The largest body a request to this route may declare. */
export function bodyLimitOf(routeId: string | null): number {
	return UPLOAD_LIMITS.get(routeId ?? '') ?? MAX_REQUEST_BODY_BYTES;
}
