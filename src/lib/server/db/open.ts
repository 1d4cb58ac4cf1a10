import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

/**
 * How long a write waits for another process's write lock. better-sqlite3 waits on the event
 * loop, so the wait is short: writes here take milliseconds, and one that cannot start within a
 * second answers 503 with Retry-After (see db/busy.ts) rather than stall every request.
 */
export const BUSY_TIMEOUT_MS = 1000;

export const DEFAULT_DATABASE_PATH = 'data/tunnelwright.db';
const MIGRATIONS_FOLDER = resolve('drizzle');

/**
 * Opens (creating if needed) the SQLite file with the settings the app relies on:
 * WAL so readers never wait for the writer, foreign keys enforced, and a busy timeout so
 * concurrent writers, in this process or another, queue instead of failing at once.
 */
export function openDatabase(path: string = DEFAULT_DATABASE_PATH): Db {
	if (path !== ':memory:') mkdirSync(dirname(resolve(path)), { recursive: true });
	const client = new Database(path);
	client.pragma('journal_mode = WAL');
	client.pragma('foreign_keys = ON');
	client.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`);
	client.pragma('synchronous = NORMAL');
	return drizzle(client, { schema }) as Db;
}

export function migrateDatabase(db: Db): void {
	migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
}

export function databasePathFromEnv(env: Record<string, string | undefined>): string {
	const url = env.DATABASE_URL?.trim();
	if (!url) return DEFAULT_DATABASE_PATH;
	return url.startsWith('file:') ? url.slice('file:'.length) : url;
}

/** A transaction handle; functions that only read and write take either. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbOrTx = Db | Tx;

/**
 * Runs a read-modify-write as one transaction that takes the write lock before its first read
 * (SQLite's BEGIN IMMEDIATE). A deferred transaction would read a snapshot another process can
 * change before the write, and then fail with SQLITE_BUSY_SNAPSHOT instead of waiting.
 */
export function writeTransaction<T>(db: Db, work: (tx: Tx) => T): T {
	return db.transaction(work, { behavior: 'immediate' });
}
