import { dirname, join } from 'node:path';
import { parseArgs } from 'node:util';
import { refuse, type Outcome } from '../../refusal';

export type BackupOptions = {
	dir: string;
	keep: number;
	/** Time from the start of one backup to the start of the next; undefined backs up once. */
	every_ms?: number;
};

export const DEFAULT_BACKUP_KEEP = 7;

const UNIT_MS = { s: 1_000, m: 60_000, h: 3_600_000, d: 86_400_000 } as const;
/** Node's timers wrap a longer delay to 1 ms, so a longer schedule would run back to back. */
const LONGEST_TIMER_MS = 2 ** 31 - 1;

export const BACKUP_USAGE = `Usage: npm run db:backup -- [--dir <folder>] [--keep <count>] [--every <duration>]

  --dir    folder for the backups (BACKUP_DIR; default: "backups" beside the database file)
  --keep   how many backups of this database to keep, newest first (BACKUP_KEEP; default ${DEFAULT_BACKUP_KEEP})
  --every  keep running and back up at this interval, e.g. 30m, 6h, 1d (BACKUP_EVERY; default: once)
           units: s, m, h, d; a whole number of one unit, at most 24d

The database is DATABASE_URL's file (default data/tunnelwright.db). Flags win over the environment.`;

/** A whole positive number of one unit: `90s`, `30m`, `6h`, `1d`. Nothing else is guessed at. */
export function parseDuration(text: string): Outcome<{ duration_ms: number }> {
	const match = /^([1-9]\d*)([smhd])$/.exec(text);
	if (!match)
		return refuse(
			'invalid',
			`"${text}" is not a duration: write a whole number and one unit (s, m, h, d), e.g. 6h.`
		);
	const duration_ms = Number(match[1]) * UNIT_MS[match[2] as keyof typeof UNIT_MS];
	if (duration_ms > LONGEST_TIMER_MS)
		return refuse('invalid', `"${text}" is too long a schedule: at most 24d.`);
	return { ok: true, duration_ms };
}

export function parseKeep(text: string): Outcome<{ keep: number }> {
	const keep = /^[1-9]\d*$/.test(text) ? Number(text) : NaN;
	if (!Number.isSafeInteger(keep))
		return refuse(
			'invalid',
			`"${text}" is not a number of backups to keep: write a whole number from 1.`
		);
	return { ok: true, keep };
}

/**
 * Reads the backup script's flags, falling back on the environment, and refuses anything it
 * cannot read exactly rather than backing up on a schedule the operator did not mean.
 */
export function readBackupOptions(
	argv: string[],
	env: Record<string, string | undefined>,
	databasePath: string
): Outcome<{ options: BackupOptions } | { help: true }> {
	let values: { dir?: string; keep?: string; every?: string; help?: boolean };
	try {
		({ values } = parseArgs({
			args: argv,
			strict: true,
			allowPositionals: false,
			options: {
				dir: { type: 'string' },
				keep: { type: 'string' },
				every: { type: 'string' },
				help: { type: 'boolean', short: 'h' }
			}
		}));
	} catch (failure) {
		return refuse('invalid', (failure as Error).message);
	}
	if (values.help) return { ok: true, help: true };

	const given = (flag: string | undefined, name: string) =>
		flag ?? (env[name]?.trim() || undefined);
	const dir = given(values.dir, 'BACKUP_DIR') ?? join(dirname(databasePath), 'backups');
	if (!dir.trim()) return refuse('invalid', 'The backup folder cannot be empty.');

	const keepText = given(values.keep, 'BACKUP_KEEP');
	const keep =
		keepText === undefined ? { ok: true as const, keep: DEFAULT_BACKUP_KEEP } : parseKeep(keepText);
	if (!keep.ok) return keep;

	const everyText = given(values.every, 'BACKUP_EVERY');
	if (everyText === undefined) return { ok: true, options: { dir, keep: keep.keep } };
	const every = parseDuration(everyText);
	if (!every.ok) return every;
	return { ok: true, options: { dir, keep: keep.keep, every_ms: every.duration_ms } };
}
