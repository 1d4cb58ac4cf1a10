import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

export const DEFAULT_DATABASE_PATH = 'data/tunnelwright.db';
const MIGRATIONS_FOLDER = resolve('drizzle');

/**
 * Opens (creating if needed) the SQLite file with the settings the app relies on:
 * WAL so readers never wait for the writer, foreign keys enforced, and a busy timeout so
 * concurrent writers queue instead of failing at once.
 */
export function openDatabase(path: string = DEFAULT_DATABASE_PATH): Db {
	if (path !== ':memory:') mkdirSync(dirname(resolve(path)), { recursive: true });
	const client = new Database(path);
	client.pragma('journal_mode = WAL');
	client.pragma('foreign_keys = ON');
	client.pragma('busy_timeout = 5000');
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
