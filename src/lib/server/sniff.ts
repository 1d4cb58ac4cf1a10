import { fileTypeFromBuffer } from 'file-type';
import isSvg from 'is-svg';
import { ATTACHMENT_TYPES, type AttachmentType } from '../schemas/model';

/** The attachment's real type from its bytes, whatever its name or declared type says. */
export async function sniffAttachmentType(bytes: Uint8Array): Promise<AttachmentType | null> {
	const detected = await fileTypeFromBuffer(bytes);
	// An SVG with an XML declaration is detected as XML; it is told apart below.
	if (detected && !detected.mime.endsWith('/xml')) {
		return (ATTACHMENT_TYPES as readonly string[]).includes(detected.mime)
			? (detected.mime as AttachmentType)
			: null;
	}
	const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes.subarray(0, 1024 * 1024));
	return isSvg(text) ? 'image/svg+xml' : null;
}
