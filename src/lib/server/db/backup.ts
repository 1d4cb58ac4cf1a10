import Database from 'better-sqlite3';
import {
	closeSync,
	existsSync,
	fsyncSync,
	mkdirSync,
	openSync,
	readdirSync,
	renameSync,
	rmSync,
	statSync
} from 'node:fs';
import { basename, extname, join } from 'node:path';

export type BackupProgress = { copiedPages: number; totalPages: number };

export type BackupRequest = {
	/** Folder the copies go to; created when missing. */
	dir: string;
	/** How many copies of this database to keep, newest first by the time in their names. */
	keep: number;
	/** The moment the copy is named after; the clock unless given. */
	now?: Date;
	/** Aborting stops the copy between steps and leaves no file behind. */
	signal?: AbortSignal;
	onProgress?: (progress: BackupProgress) => void;
};

export type BackupReport = {
	path: string;
	bytes: number;
	pages: number;
	elapsed_ms: number;
	/** Times a write by another connection made SQLite start the copy over. */
	restarts: number;
	removed: string[];
};

/*
 * Pages copied per step at first. In WAL mode a step holds only a read snapshot, so writers never
 * wait on it; steps exist to let the event loop (signals, progress) run between them.
 */
const FIRST_STEP_PAGES = 1024;
/** The largest step better-sqlite3 accepts; one step of this size copies any database whole. */
const MAX_STEP_PAGES = 0x7fffffff;

/**
 * Makes an online copy of `source` with SQLite's backup API, which reads through the WAL so
 * committed writes not yet checkpointed are in the copy, unlike a copy of the file.
 * The copy is written under a temporary name and only renamed to its final name once it passed
 * `PRAGMA integrity_check`; then copies beyond `keep` are removed.
 */
export async function backupDatabase(
	source: Database.Database,
	request: BackupRequest
): Promise<BackupReport> {
	const started = performance.now();
	const stem = databaseStem(source.name);
	const path = join(request.dir, backupFileName(stem, request.now ?? new Date()));
	if (existsSync(path)) throw new Error(`A backup named ${path} already exists.`);
	const partial = `${path}.partial`;
	mkdirSync(request.dir, { recursive: true });
	rmSync(partial, { force: true });
	try {
		request.signal?.throwIfAborted();
		const restarts = await copyPages(source, partial, request);
		const pages = finishCopy(partial);
		renameSync(partial, path);
		syncFolder(request.dir);
		const bytes = statSync(path).size;
		const removed = pruneBackups(request.dir, stem, request.keep);
		const elapsed_ms = performance.now() - started;
		return { path, bytes, pages, elapsed_ms, restarts, removed };
	} catch (failure) {
		rmSync(partial, { force: true });
		throw failure;
	}
}

/**
 * Runs the backup in steps. SQLite restarts a backup from the first page whenever another
 * connection writes to the source between steps, so under a steady write load a fixed small step
 * might never finish; each restart doubles the step until one step copies everything under a
 * single read snapshot.
 */
async function copyPages(
	source: Database.Database,
	destination: string,
	{ signal, onProgress }: BackupRequest
): Promise<number> {
	let stepPages = 0;
	let copiedBefore = 0;
	let restarts = 0;
	await source.backup(destination, {
		progress: ({ totalPages, remainingPages }) => {
			signal?.throwIfAborted();
			const copiedPages = totalPages - remainingPages;
			if (stepPages > 0 && copiedPages < Math.min(copiedBefore + stepPages, totalPages)) {
				restarts += 1;
				stepPages = Math.min(stepPages * 2, MAX_STEP_PAGES);
			}
			if (stepPages === 0) stepPages = FIRST_STEP_PAGES;
			copiedBefore = copiedPages;
			onProgress?.({ copiedPages, totalPages });
			return stepPages;
		}
	});
	return restarts;
}

/**
 * Switches the copy to a rollback journal so it is one self-contained file (the source's WAL
 * mode comes along in the header, and a WAL file would sprout -wal and -shm files whenever it is
 * opened), checks it, and returns its page count. Restored over the app's file, the app switches
 * it back to WAL when it opens it.
 */
function finishCopy(path: string): number {
	const copy = new Database(path, { fileMustExist: true });
	try {
		copy.pragma('journal_mode = DELETE');
		const problems = (copy.pragma('integrity_check') as { integrity_check: string }[]).map(
			(row) => row.integrity_check
		);
		if (problems.length !== 1 || problems[0] !== 'ok')
			throw new Error(
				`The backup failed its integrity check: ${problems.slice(0, 3).join('; ')}` +
					(problems.length > 3 ? ` and ${problems.length - 3} more` : '')
			);
		return copy.pragma('page_count', { simple: true }) as number;
	} finally {
		copy.close();
	}
}

/** A rename is durable only once the folder that holds the name is synced. */
function syncFolder(dir: string): void {
	const handle = openSync(dir, 'r');
	try {
		fsyncSync(handle);
	} finally {
		closeSync(handle);
	}
}

/**
 * Removes all but the newest `keep` backups of the database named `stem` in `dir`. Only files
 * whose names this module writes are counted or removed; anything else in the folder is left.
 */
export function pruneBackups(dir: string, stem: string, keep: number): string[] {
	const ours = readdirSync(dir)
		.filter((name) => isBackupOf(stem, name))
		.sort()
		.reverse();
	const removed = ours.slice(keep).map((name) => join(dir, name));
	for (const path of removed) rmSync(path);
	return removed;
}

/**
 * `<stem>-<UTC time in ISO 8601 basic format>.db`, e.g. `tunnelwright-20261202T085609.123Z.db`:
 * names sort by time, and hold no colons, which some file systems refuse.
 */
export function backupFileName(stem: string, at: Date): string {
	return `${stem}-${at.toISOString().replace(/[-:]/g, '')}.db`;
}

const BACKUP_TIME = /^\d{8}T\d{6}\.\d{3}Z\.db$/;

/** Whether `name` is one of the backups `backupFileName` writes for the database named `stem`. */
export function isBackupOf(stem: string, name: string): boolean {
	return name.startsWith(`${stem}-`) && BACKUP_TIME.test(name.slice(stem.length + 1));
}

/** The database file's name without its extension, which names its backups. */
export function databaseStem(path: string): string {
	return basename(path, extname(path)) || 'database';
}
