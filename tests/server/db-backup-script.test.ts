import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { migrateDatabase, openDatabase } from '../../src/lib/server/db/open';

const folders: string[] = [];
afterEach(() => {
	for (const dir of folders.splice(0)) rmSync(dir, { recursive: true, force: true });
});

function migratedDatabase(): { dir: string; path: string } {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-backup-script-'));
	folders.push(dir);
	const path = join(dir, 'app.db');
	const db = openDatabase(path);
	migrateDatabase(db);
	db.$client.close();
	return { dir, path };
}

/** Runs `npm run db:backup` as node would, stopping it with `signal` once `stopAfter` lines are out. */
function runBackupScript(
	args: string[],
	env: Record<string, string>,
	stopAfter?: { lines: number; signal: NodeJS.Signals }
): Promise<{ code: number | null; stdout: string; stderr: string }> {
	const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/db-backup.ts', ...args], {
		env: { ...process.env, ...env }
	});
	let stdout = '';
	let stderr = '';
	child.stdout.on('data', (chunk: Buffer) => {
		stdout += chunk.toString();
		if (stopAfter && stdout.split('\n').length > stopAfter.lines) child.kill(stopAfter.signal);
	});
	child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
	return new Promise((resolve) => child.on('close', (code) => resolve({ code, stdout, stderr })));
}

describe('npm run db:backup', () => {
	it('refuses a schedule it cannot read with exit code 2 and says why', async () => {
		const { dir, path } = migratedDatabase();
		const run = await runBackupScript(['--every', '6x'], { DATABASE_URL: path });
		expect(run.code).toBe(2);
		expect(run.stderr).toContain('"6x" is not a duration');
		expect(readdirSync(dir)).not.toContain('backups');
	}, 30_000);

	it('on a schedule backs up until SIGTERM, then exits cleanly keeping the newest', async () => {
		const { dir, path } = migratedDatabase();
		const run = await runBackupScript(
			['--every', '1s', '--keep', '2'],
			{ DATABASE_URL: `file:${path}` },
			{ lines: 3, signal: 'SIGTERM' }
		);
		expect(run.code).toBe(0);
		const summaries = run.stdout.trim().split('\n');
		expect(summaries.length).toBeGreaterThanOrEqual(3);
		for (const line of summaries) expect(line).toMatch(/backed up .* integrity ok/);
		const files = readdirSync(join(dir, 'backups'));
		expect(files).toHaveLength(2);
		expect(files.every((name) => /^app-\d{8}T\d{6}\.\d{3}Z\.db$/.test(name))).toBe(true);
	}, 30_000);
});
