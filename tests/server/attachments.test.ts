import { describe, expect, it } from 'vitest';
import { ATTACHMENT_MAX_BYTES } from '../../src/lib/schemas/model';
import { addAttachment, getAttachmentFor, listAttachments } from '../../src/lib/server/models';
import { campaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';
import { readStored, tempStore as store } from './temp-store';

// Signatures from the formats' own specifications: PDF "%PDF-" (ISO 32000-1 §7.5.2),
// PNG's eight-byte signature (RFC 2083 §3.1), JPEG's SOI marker FF D8 FF (ITU-T T.81).
const PDF = new TextEncoder().encode('%PDF-1.7\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n');
const PNG = new Uint8Array([
	0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1,
	0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde
]);
const JPEG = new Uint8Array([
	0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46, 0, 1, 1, 0, 0, 1, 0, 1, 0, 0, 0xff, 0xd9
]);
const SVG = new TextEncoder().encode(
	'<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>'
);
const ZIP = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 20, 0, 0, 0, 8, 0]);

describe('model attachments', () => {
	it.each([
		['drawing.pdf', 'application/pdf', PDF],
		['photo.png', 'image/png', PNG],
		['photo.jpg', 'image/jpeg', JPEG],
		['outline.svg', 'image/svg+xml', SVG],
		['named-wrongly.png', 'application/pdf', PDF]
	])('takes %s by its bytes as %s', async (name, type, bytes) => {
		const db = tempDb();
		const w = campaignWorld(db);
		const blobs = store();
		const added = await addAttachment(db, blobs, w.aeroA, w.modelA, { name, bytes });
		expect(added.ok).toBe(true);
		const [stored] = listAttachments(db, w.modelA);
		expect(stored).toMatchObject({ fileName: name, mediaType: type, size_bytes: bytes.byteLength });
		expect(stored!.sha256).toMatch(/^[0-9a-f]{64}$/);
		expect(await readStored(stored!)).toEqual(bytes);
		expect(stored!.storageKey).not.toContain(name);
	});

	it.each([
		['archive.pdf', /PDF, PNG, JPEG or SVG/, ZIP],
		['empty.png', /empty/, new Uint8Array()],
		['huge.pdf', /at most 10 MiB/, new Uint8Array(ATTACHMENT_MAX_BYTES + 1).fill(0x25)]
	])('refuses %s and stores nothing (%s)', async (name, message, bytes) => {
		const db = tempDb();
		const w = campaignWorld(db);
		const added = await addAttachment(db, store(), w.aeroA, w.modelA, { name, bytes });
		expect(added).toMatchObject({ ok: false, message: expect.stringMatching(message) });
		expect(listAttachments(db, w.modelA)).toEqual([]);
	});

	it('are out of reach for other teams', async () => {
		const db = tempDb();
		const w = campaignWorld(db);
		const added = await addAttachment(db, store(), w.aeroA, w.modelA, {
			name: 'a.pdf',
			bytes: PDF
		});
		if (!added.ok) throw new Error(added.message);
		expect(getAttachmentFor(db, w.aeroB, added.id)).toBeUndefined();
		expect(getAttachmentFor(db, w.aeroA2, added.id)?.id).toBe(added.id);
		expect(
			await addAttachment(db, store(), w.aeroB, w.modelA, { name: 'x.pdf', bytes: PDF })
		).toMatchObject({ code: 'not-found' });
	});
});
