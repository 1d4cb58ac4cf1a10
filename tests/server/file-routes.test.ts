import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import { modelAttachment, readingsUpload } from '../../src/lib/server/db/schema';
import { addAttachment } from '../../src/lib/server/models';
import { receiveReadings } from '../../src/lib/server/readings';
import type { ObjectStore } from '../../src/lib/server/storage/object-store';
import * as attachmentFile from '../../src/routes/(app)/models/[id]/attachments/[attachmentId]/+server';
import * as originalFile from '../../src/routes/(app)/campaigns/[id]/readings/[upload]/+server';
import { approvedCampaignWorld } from './campaign-fixtures';
import { callRoute, type Handler } from './call-route';
import { tempDb } from './temp-db';
import { tempStore } from './temp-store';

const ORIGIN = 'http://localhost';
// ISO 32000-1 §7.5.2: a PDF begins with "%PDF-".
const PDF = new TextEncoder().encode('%PDF-1.7\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n');
const CSV =
	'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit\n' +
	'1,static,-2.0,mmH2O,57.89,Pa,20,1013.25,hPa\n';

/** A store any use of which fails the test: access must be settled before the store is asked. */
const untouchable = new Proxy({} as ObjectStore, {
	get: () => {
		throw new Error('The file store was reached before access was settled.');
	}
});

async function world() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const store = tempStore();
	const added = await addAttachment(db, store, w.aeroA, w.modelA, { name: 'nose.pdf', bytes: PDF });
	const received = await receiveReadings(db, store, w.aeroA, w.campaignId, {
		fileName: 'run 1.csv',
		mediaType: 'text/csv',
		bytes: new TextEncoder().encode(CSV),
		channel: 'api'
	});
	if (!added.ok || !received.ok) throw new Error('The fixture files were not stored.');
	const get = (
		handler: Handler,
		user: SessionUser,
		params: Record<string, string>,
		files: ObjectStore = store
	) => callRoute(handler, db, user, { params, files });
	return {
		db,
		w,
		store,
		attachment: (user: SessionUser, files?: ObjectStore) =>
			get(attachmentFile.GET, user, { id: w.modelA, attachmentId: added.id }, files),
		original: (user: SessionUser, files?: ObjectStore) =>
			get(originalFile.GET, user, { id: w.campaignId, upload: received.id }, files)
	};
}

describe('stored files are served through routes that check access first', () => {
	it('streams an attachment to its team with its length', async () => {
		const { w, attachment } = await world();
		const answer = await attachment(w.aeroA2);
		expect(answer.status).toBe(200);
		expect(answer.headers.get('content-length')).toBe(String(PDF.byteLength));
		expect(answer.headers.get('content-type')).toBe('application/pdf');
		expect(answer.body).toBe(new TextDecoder().decode(PDF));
	});

	it('streams an original readings file with its length and checksum', async () => {
		const { w, original } = await world();
		const answer = await original(w.reviewer);
		expect(answer.status).toBe(200);
		expect(answer.headers.get('content-length')).toBe(String(CSV.length));
		expect(answer.headers.get('x-checksum-sha256')).toMatch(/^[0-9a-f]{64}$/);
		expect(answer.body).toBe(CSV);
	});

	it('refuses other teams and other roles without reaching the store', async () => {
		const { w, attachment, original } = await world();
		expect((await attachment(w.aeroB, untouchable)).status).toBe(404);
		expect((await attachment(w.reviewer, untouchable)).status).toBe(403);
		expect((await original(w.aeroB, untouchable)).status).toBe(404);
	});

	it('answers 404 for a file gone from the store, and breaks off a damaged one', async () => {
		const { db, w, store, attachment, original } = await world();
		const upload = db.select().from(readingsUpload).get();
		await store.put(new TextEncoder().encode(CSV.replace('-2.0', '-9.0')), upload!.storageKey);
		await expect(original(w.aeroA)).rejects.toThrow(/does not match its SHA-256/);

		const kept = db.select().from(modelAttachment).get();
		await store.remove(kept!.storageKey);
		expect((await attachment(w.aeroA)).status).toBe(404);
	});
});
