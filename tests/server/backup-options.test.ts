import { describe, expect, it } from 'vitest';
import {
	DEFAULT_BACKUP_KEEP,
	parseDuration,
	parseKeep,
	readBackupOptions
} from '../../src/lib/server/db/backup-options';

const HOUR_MS = 3_600_000;

describe('a backup schedule', () => {
	it.each([
		['90s', 90_000],
		['30m', 30 * 60_000],
		['6h', 6 * HOUR_MS],
		['1d', 24 * HOUR_MS],
		['24d', 24 * 24 * HOUR_MS]
	])('reads %s', (text, duration_ms) => {
		expect(parseDuration(text)).toEqual({ ok: true, duration_ms });
	});

	it.each([
		'',
		'6',
		'h',
		'0h',
		'-1h',
		'+6h',
		'1.5h',
		'6 h',
		' 6h',
		'6H',
		'06h',
		'1h30m',
		'6hours',
		'25d'
	])('refuses %j', (text) => {
		const read = parseDuration(text);
		expect(read.ok).toBe(false);
		if (!read.ok) expect(read.message).toContain(`"${text}"`);
	});

	it('refuses a schedule longer than a timer can wait', () => {
		// Node's setTimeout waits at most 2^31 - 1 ms, about 24.8 d (Node.js timers documentation).
		expect(parseDuration('25d')).toMatchObject({
			ok: false,
			message: expect.stringMatching(/at most 24d/)
		});
	});
});

describe('the number of backups kept', () => {
	it.each([
		['1', 1],
		['7', 7],
		['365', 365]
	])('reads %s', (text, keep) => {
		expect(parseKeep(text)).toEqual({ ok: true, keep });
	});

	it.each(['', '0', '-1', '1.5', '1e3', '07', 'seven', ' 7', '99999999999999999999'])(
		'refuses %j',
		(text) => {
			expect(parseKeep(text).ok).toBe(false);
		}
	);
});

describe('the backup options', () => {
	const database = 'data/tunnelwright.db';

	it('defaults to one backup into a folder beside the database, keeping the default count', () => {
		expect(readBackupOptions([], {}, database)).toEqual({
			ok: true,
			options: { dir: 'data/backups', keep: DEFAULT_BACKUP_KEEP }
		});
	});

	it('reads the environment, and flags win over it', () => {
		const env = { BACKUP_DIR: '/srv/backups', BACKUP_KEEP: '14', BACKUP_EVERY: '1d' };
		expect(readBackupOptions([], env, database)).toEqual({
			ok: true,
			options: { dir: '/srv/backups', keep: 14, every_ms: 24 * HOUR_MS }
		});
		expect(
			readBackupOptions(['--keep', '3', '--every', '6h', '--dir', 'b'], env, database)
		).toEqual({
			ok: true,
			options: { dir: 'b', keep: 3, every_ms: 6 * HOUR_MS }
		});
	});

	it('treats an empty variable as unset', () => {
		expect(readBackupOptions([], { BACKUP_KEEP: ' ', BACKUP_EVERY: '' }, database)).toEqual({
			ok: true,
			options: { dir: 'data/backups', keep: DEFAULT_BACKUP_KEEP }
		});
	});

	it.each([
		[['--every', '6x'], {}],
		[['--every', ''], {}],
		[['--every'], {}],
		[['--keep', '0'], {}],
		[['--dir', ''], {}],
		[['--often'], {}],
		[['now'], {}],
		[[], { BACKUP_KEEP: 'all' }],
		[[], { BACKUP_EVERY: 'daily' }]
	])('refuses %j with %j', (argv, env) => {
		expect(readBackupOptions(argv, env, database)).toMatchObject({ ok: false, code: 'invalid' });
	});
});
