/**
 * Online backup of the app's database: once, or with --every on a schedule until SIGINT or
 * SIGTERM. Exit codes: 0 done, 1 a one-off backup failed, 2 the options were refused.
 */
import Database from 'better-sqlite3';
import { existsSync } from 'node:fs';
import { setTimeout as sleep } from 'node:timers/promises';
import { backupDatabase, type BackupProgress } from '../src/lib/server/db/backup';
import { BACKUP_USAGE, readBackupOptions } from '../src/lib/server/db/backup-options';
import { databasePathFromEnv } from '../src/lib/server/db/open';

const databasePath = databasePathFromEnv(process.env);
const read = readBackupOptions(process.argv.slice(2), process.env, databasePath);
if (!read.ok) {
	console.error(`db:backup: ${read.message}\n\n${BACKUP_USAGE}`);
	process.exit(2);
}
if ('help' in read) {
	console.log(BACKUP_USAGE);
	process.exit(0);
}
const { dir, keep, every_ms } = read.options;
if (!existsSync(databasePath)) {
	console.error(`db:backup: there is no database at ${databasePath} (DATABASE_URL).`);
	process.exit(1);
}

// Read-only: a backup never writes to the source, and opening must not create an empty database.
const source = new Database(databasePath, { readonly: true, fileMustExist: true });
source.pragma('busy_timeout = 5000');

const stop = new AbortController();
for (const signal of ['SIGINT', 'SIGTERM'] as const)
	process.once(signal, () => {
		console.error(`db:backup: ${signal}, stopping.`);
		stop.abort();
	});

/** Pages done / total on a terminal, rewritten in place; logs stay free of it. */
function showProgress({ copiedPages, totalPages }: BackupProgress): void {
	if (process.stderr.isTTY && copiedPages > 0)
		process.stderr.write(`\r${copiedPages} / ${totalPages} pages`);
}

function mebibytes(bytes: number): string {
	return `${(bytes / 1024 / 1024).toFixed(2)} MiB`;
}

async function backupOnce(): Promise<boolean> {
	try {
		const report = await backupDatabase(source, {
			dir,
			keep,
			signal: stop.signal,
			onProgress: showProgress
		});
		if (process.stderr.isTTY) process.stderr.write('\r\x1b[K');
		console.log(
			`${new Date().toISOString()} backed up ${databasePath} to ${report.path}: ` +
				`${mebibytes(report.bytes)}, ${report.pages} pages, ${report.elapsed_ms.toFixed(0)} ms, ` +
				`${report.restarts} restarts, integrity ok; removed ${report.removed.length}, keeping ${keep}`
		);
		return true;
	} catch (failure) {
		if (stop.signal.aborted) return false;
		console.error(
			`${new Date().toISOString()} backup of ${databasePath} failed: ${String(failure)}`
		);
		return false;
	}
}

let succeeded = true;
while (!stop.signal.aborted) {
	const started = Date.now();
	succeeded = await backupOnce();
	if (every_ms === undefined) break;
	// From start to start, so the schedule does not drift by each backup's own duration.
	await sleep(Math.max(0, started + every_ms - Date.now()), undefined, {
		signal: stop.signal
	}).catch(() => undefined);
}
source.close();
process.exitCode = every_ms === undefined && !succeeded ? 1 : 0;
