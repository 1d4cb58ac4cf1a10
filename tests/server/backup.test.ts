import Database from 'better-sqlite3';
import {
	closeSync,
	copyFileSync,
	mkdtempSync,
	openSync,
	readdirSync,
	readSync,
	rmSync,
	writeFileSync,
	writeSync
} from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { backupDatabase, backupFileName, pruneBackups } from '../../src/lib/server/db/backup';
import { openDatabase } from '../../src/lib/server/db/open';
import { appSetting } from '../../src/lib/server/db/schema';
import { loadTeamId, startTeamWriter } from './backup-load';
import { addTeam, tempDb } from './temp-db';

const folders: string[] = [];
afterEach(() => {
	for (const dir of folders.splice(0)) rmSync(dir, { recursive: true, force: true });
});
function tempFolder(): string {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-backup-'));
	folders.push(dir);
	return dir;
}

type Row = Record<string, unknown>;
function tableNames(db: Database.Database): string[] {
	return db
		.prepare("select name from sqlite_master where type = 'table' order by name")
		.pluck()
		.all() as string[];
}
function rowsOf(db: Database.Database, table: string): Row[] {
	return db.prepare(`select * from "${table}" order by rowid`).all() as Row[];
}
function teamCount(db: Database.Database): number {
	return db.prepare('select count(*) from team').pluck().get() as number;
}

/** Restores as the README says (a plain copy while nothing has the file open) and opens it as the app does. */
function restore(backupPath: string): Database.Database {
	const path = join(tempFolder(), 'restored.db');
	copyFileSync(backupPath, path);
	return openDatabase(path).$client;
}

describe('an online backup', () => {
	it('under a steady write load holds a consistent prefix of the writes and every table', async () => {
		const db = tempDb();
		const source = db.$client;
		addTeam(db, 'Quiet team');
		// Several thousand pages, so the copy takes several steps and the writer can get between them.
		const filler = 'x'.repeat(4000);
		db.transaction((tx) => {
			for (let i = 0; i < 3000; i++)
				tx.insert(appSetting)
					.values({ key: `filler-${i}`, value: filler })
					.run();
		});
		const writer = startTeamWriter(source.name);
		try {
			writer.waitPast(20);
			const countBefore = teamCount(source);
			const report = await backupDatabase(source, {
				dir: tempFolder(),
				keep: 2,
				// Let at least one write commit between every two steps, so the load always overlaps.
				onProgress: () => writer.waitPast(writer.written())
			});
			const countAfter = teamCount(source);
			await writer.stop();

			expect(report.restarts).toBeGreaterThan(0);
			expect(countAfter).toBeGreaterThan(countBefore);
			const copy = restore(report.path);
			expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
			expect(tableNames(copy)).toEqual(tableNames(source));
			expect(tableNames(copy)).toContain('__drizzle_migrations');

			for (const table of tableNames(source)) {
				const inSource = new Set(rowsOf(source, table).map((row) => JSON.stringify(row)));
				const inCopy = rowsOf(copy, table).map((row) => JSON.stringify(row));
				expect(
					inCopy.filter((row) => !inSource.has(row)),
					table
				).toEqual([]);
				if (table !== 'team') expect(inCopy.length, table).toBe(inSource.size);
			}
			const copied = teamCount(copy);
			expect(copied).toBeGreaterThanOrEqual(countBefore);
			expect(copied).toBeLessThanOrEqual(countAfter);
			// A snapshot, not a mix: the load's teams in the copy are exactly the first ones written.
			const loadIds = copy
				.prepare("select id from team where id like 'load-%' order by id")
				.pluck()
				.all();
			expect(loadIds).toEqual(Array.from({ length: copied - 1 }, (_, i) => loadTeamId(i + 1)));
			copy.close();
		} finally {
			await writer.stop();
		}
	}, 30_000);

	it('holds commits still in the WAL, which a copy of the database file misses', async () => {
		const db = tempDb();
		db.$client.pragma('wal_autocheckpoint = 0');
		addTeam(db, 'Only in the WAL');
		const dir = tempFolder();
		const fileCopy = join(dir, 'file-copy.db');
		copyFileSync(db.$client.name, fileCopy);

		const report = await backupDatabase(db.$client, { dir, keep: 1 });

		const teamsIn = (path: string) => {
			const copy = new Database(path, { readonly: true });
			const names = copy.prepare('select name from team').pluck().all();
			copy.close();
			return names;
		};
		expect(teamsIn(report.path)).toEqual(['Only in the WAL']);
		expect(() => teamsIn(fileCopy)).toThrow(/no such table/);
	});

	it('is one self-contained file named by its UTC time, with what it did', async () => {
		const db = tempDb();
		const dir = tempFolder();
		const report = await backupDatabase(db.$client, {
			dir,
			keep: 1,
			now: new Date('2026-12-02T08:56:09.123Z')
		});
		// ISO 8601 basic format: no colons, and names sort in time order.
		expect(report.path).toBe(join(dir, 'test-20261202T085609.123Z.db'));
		expect(readdirSync(dir)).toEqual(['test-20261202T085609.123Z.db']);
		const copy = new Database(report.path, { readonly: true });
		expect(copy.pragma('journal_mode', { simple: true })).toBe('delete');
		expect(report.pages).toBe(copy.pragma('page_count', { simple: true }));
		expect(report.bytes).toBe(
			report.pages * (copy.pragma('page_size', { simple: true }) as number)
		);
		expect(report.elapsed_ms).toBeGreaterThan(0);
		copy.close();
	});

	it('stopped part-way leaves no file behind', async () => {
		const db = tempDb();
		db.transaction((tx) => {
			for (let i = 0; i < 2000; i++)
				tx.insert(appSetting)
					.values({ key: `filler-${i}`, value: 'x'.repeat(4000) })
					.run();
		});
		const dir = tempFolder();
		const stop = new AbortController();
		const progress: number[] = [];
		await expect(
			backupDatabase(db.$client, {
				dir,
				keep: 1,
				signal: stop.signal,
				onProgress: ({ copiedPages }) => {
					progress.push(copiedPages);
					if (copiedPages > 0) stop.abort();
				}
			})
		).rejects.toThrow(/abort/i);
		expect(progress.at(-1)).toBeGreaterThan(0);
		expect(readdirSync(dir)).toEqual([]);
	});
});

/** A database whose index no longer matches its rows, as a torn write could leave it. */
function damagedDatabase(): string {
	const path = join(tempFolder(), 'damaged.db');
	const db = new Database(path);
	db.exec('create table reading (label text); create index reading_label on reading (label)');
	const insert = db.prepare('insert into reading values (?)');
	for (let i = 0; i < 50; i++) insert.run(`probe-${i}`);
	const rootPage = db
		.prepare("select rootpage from sqlite_master where name = 'reading_label'")
		.pluck()
		.get() as number;
	const pageSize = db.pragma('page_size', { simple: true }) as number;
	db.close();
	const file = openSync(path, 'r+');
	const page = Buffer.alloc(pageSize);
	readSync(file, page, 0, pageSize, (rootPage - 1) * pageSize);
	const renamed = Buffer.from(page.toString('latin1').replaceAll('probe-', 'PROBE-'), 'latin1');
	writeSync(file, renamed, 0, pageSize, (rootPage - 1) * pageSize);
	closeSync(file);
	return path;
}

describe('the check of a copy', () => {
	it('refuses a copy that fails integrity_check, leaving the older backups in place', async () => {
		const path = damagedDatabase();
		const dir = tempFolder();
		const goodOne = join(dir, backupFileName('damaged', new Date('2026-12-01T00:00:00Z')));
		writeFileSync(goodOne, 'an earlier backup');
		const source = new Database(path, { readonly: true });

		await expect(backupDatabase(source, { dir, keep: 1 })).rejects.toThrow(
			/integrity check: row 1 missing from index reading_label/
		);
		source.close();
		expect(readdirSync(dir)).toEqual([basename(goodOne)]);
	});
});

describe('pruning', () => {
	it('keeps exactly the newest N backups of this database and nothing else is touched', async () => {
		const db = tempDb();
		const dir = tempFolder();
		const others = [
			'notes.txt',
			'other-20200101T000000.000Z.db',
			'test-20200101T000000.000Z.db.partial'
		];
		for (const name of others) writeFileSync(join(dir, name), 'not ours');
		const times = [1, 2, 3, 4, 5].map((day) => new Date(Date.UTC(2026, 11, day, 6)));
		const removed: string[] = [];
		for (const now of times)
			removed.push(...(await backupDatabase(db.$client, { dir, keep: 3, now })).removed);

		const kept = times.slice(2).map((at) => backupFileName('test', at));
		expect(readdirSync(dir).sort()).toEqual([...kept, ...others].sort());
		expect(removed).toEqual(times.slice(0, 2).map((at) => join(dir, backupFileName('test', at))));

		expect(pruneBackups(dir, 'test', 1).sort()).toEqual(
			kept.slice(0, 2).map((name) => join(dir, name))
		);
		expect(readdirSync(dir).sort()).toEqual([kept[2], ...others].sort());
	});

	it('counts by the time in the name, not by when the files were written', () => {
		const dir = tempFolder();
		const newestFirst = ['2026-12-03', '2026-12-02', '2026-12-01'].map((day) =>
			backupFileName('tw', new Date(`${day}T00:00:00Z`))
		);
		for (const name of [newestFirst[1], newestFirst[0], newestFirst[2]])
			writeFileSync(join(dir, name!), '');
		expect(pruneBackups(dir, 'tw', 2)).toEqual([join(dir, newestFirst[2]!)]);
		expect(readdirSync(dir).sort()).toEqual(newestFirst.slice(0, 2).sort());
	});
});
