import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { BUSY_TIMEOUT_MS, migrateDatabase, openDatabase } from '../../src/lib/server/db/open';
import { storedSecret } from '../../src/lib/server/settings';

it('keeps the generated session secret across a restart, so sessions survive it', () => {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-settings-'));
	try {
		const path = join(dir, 'app.db');
		const first = openDatabase(path);
		migrateDatabase(first);
		const secret = storedSecret(first, 'auth-secret');
		expect(secret).toMatch(/^[\w-]{43}$/);
		expect(storedSecret(first, 'auth-secret')).toBe(secret);
		first.$client.close();

		const reopened = openDatabase(path);
		expect(storedSecret(reopened, 'auth-secret')).toBe(secret);
		expect(storedSecret(reopened, 'other')).not.toBe(secret);
		reopened.$client.close();
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
});

it('opens with WAL, foreign keys and a busy timeout', () => {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-pragmas-'));
	try {
		const db = openDatabase(join(dir, 'app.db'));
		expect(db.$client.pragma('journal_mode', { simple: true })).toBe('wal');
		expect(db.$client.pragma('foreign_keys', { simple: true })).toBe(1);
		expect(db.$client.pragma('busy_timeout', { simple: true })).toBe(BUSY_TIMEOUT_MS);
		db.$client.close();
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
});
