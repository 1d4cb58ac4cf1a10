// `npm run storage:migrate`: moves the files kept on disk before the object store (ATTACHMENTS_DIR)
// into the store S3_URL names, or the local one. Safe to run again; the disk folder is only read.
import { databasePathFromEnv, migrateDatabase, openDatabase } from '../src/lib/server/db/open';
import { moveDiskFiles } from '../src/lib/server/storage/disk-migration';
import { attachmentsDirFromEnv, openObjectStore } from '../src/lib/server/storage/open';

const db = openDatabase(databasePathFromEnv(process.env));
migrateDatabase(db);
const opened = await openObjectStore(process.env);
const folder = attachmentsDirFromEnv(process.env);
try {
	const counts = await moveDiskFiles(db, opened.store, folder);
	console.log(
		`Files from ${folder}: ${counts.copied} copied and checked, ${counts.present} already in the store, ` +
			`${counts.missing} missing, ${counts.damaged} damaged (not copied), ` +
			`${counts.unreferenced} on disk without a record (left there).`
	);
	if (counts.missing || counts.damaged) process.exitCode = 1;
} finally {
	await opened.close();
	db.$client.close();
}
