import { eq } from 'drizzle-orm';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import type { Db } from '../../src/lib/server/db/open';
import { modelAttachment, readingsUpload } from '../../src/lib/server/db/schema';
import { addAttachment } from '../../src/lib/server/models';
import { receiveReadings } from '../../src/lib/server/readings';
import { moveDiskFiles } from '../../src/lib/server/storage/disk-migration';
import { approvedCampaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';
import { readStored, tempStore } from './temp-store';

const folders: string[] = [];
afterEach(() => folders.splice(0).forEach((f) => rmSync(f, { recursive: true, force: true })));

// ISO 32000-1 §7.5.2: a PDF begins with "%PDF-".
const PDF = new TextEncoder().encode('%PDF-1.7\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n');
const csv = (reading: string) =>
	new TextEncoder().encode(
		'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit\n' +
			`1,static,${reading},mmH2O,57.89,Pa,20,1013.25,hPa\n`
	);

/** Writes a file where the app kept it on disk before: `<folder>/<first two>/<key>`. */
function onDisk(folder: string, key: string, bytes: Uint8Array) {
	mkdirSync(join(folder, key.slice(0, 2)), { recursive: true });
	writeFileSync(join(folder, key.slice(0, 2), key), bytes);
}

/**
 * A database whose files are on disk only, as the app kept them before the object store: an
 * attachment recorded without a checksum, and a readings file with its checksum.
 */
async function diskWorld() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, 'http://localhost');
	const store = tempStore();
	const folder = mkdtempSync(join(tmpdir(), 'tunnelwright-disk-'));
	folders.push(folder);
	const added = await addAttachment(db, store, w.aeroA, w.modelA, { name: 'a.pdf', bytes: PDF });
	if (!added.ok) throw new Error(added.message);
	// The row as it was stored, checksum included, to compare the filled-in one with.
	const attachment = db.select().from(modelAttachment).get()!;
	db.update(modelAttachment).set({ sha256: null }).run();
	onDisk(folder, attachment.storageKey, PDF);
	await store.remove(attachment.storageKey);

	const send = async (bytes: Uint8Array) => {
		const sent = await receiveReadings(
			db,
			store,
			w.aeroA,
			w.campaignId,
			{ fileName: 'r.csv', mediaType: 'text/csv', bytes, channel: 'api' },
			{ replace: true }
		);
		if (!sent.ok) throw new Error(sent.message);
		const upload = db.select().from(readingsUpload).where(eq(readingsUpload.id, sent.id)).get()!;
		await store.remove(upload.storageKey);
		return upload;
	};
	return { db, store, folder, attachment, send };
}

const checksumOf = (db: Db, key: string) =>
	db.select().from(modelAttachment).where(eq(modelAttachment.storageKey, key)).get()?.sha256;

describe('moving files from the old disk folder into the object store', () => {
	it('copies each recorded file under its own key, checks it and skips it on a second run', async () => {
		const { db, store, folder, attachment, send } = await diskWorld();
		const upload = await send(csv('-2.0'));
		onDisk(folder, upload.storageKey, csv('-2.0'));
		onDisk(folder, 'ffffffffffffffffffffffffffffffff', PDF);

		expect(await moveDiskFiles(db, store, folder)).toEqual({
			copied: 2,
			present: 0,
			missing: 0,
			damaged: 0,
			unreferenced: 1
		});
		expect(await readStored(upload)).toEqual(csv('-2.0'));
		expect(attachment.sha256).toMatch(/^[0-9a-f]{64}$/);
		expect(checksumOf(db, attachment.storageKey)).toBe(attachment.sha256);
		expect(await readStored(attachment)).toEqual(PDF);

		expect(await moveDiskFiles(db, store, folder)).toMatchObject({ copied: 0, present: 2 });
	});

	it('leaves out a file whose disk copy does not match its record, and counts missing ones', async () => {
		const { db, store, folder, send } = await diskWorld();
		const damaged = await send(csv('-2.0'));
		onDisk(folder, damaged.storageKey, csv('-3.0'));
		await send(csv('-4.0'));

		expect(await moveDiskFiles(db, store, folder)).toMatchObject({
			copied: 1,
			damaged: 1,
			missing: 1
		});
		expect(await store.sizeOf(damaged.storageKey)).toBeUndefined();
	});

	it('fills in the checksum of an attachment already in the store', async () => {
		const { db, store, attachment } = await diskWorld();
		await store.put(PDF, attachment.storageKey);
		const empty = mkdtempSync(join(tmpdir(), 'tunnelwright-disk-'));
		folders.push(empty);
		expect(await moveDiskFiles(db, store, empty)).toMatchObject({ copied: 0, present: 1 });
		expect(checksumOf(db, attachment.storageKey)).toBe(attachment.sha256);
	});
});
