import { createRequire } from 'node:module';
import { Worker } from 'node:worker_threads';

/** Ids that sort in the order the writer inserts them. */
export function loadTeamId(n: number): string {
	return `load-${String(n).padStart(9, '0')}`;
}

/*
 * Runs in its own thread with its own connection, so SQLite sees the writes as another
 * connection's, as it would the app's while the backup script runs. One team per transaction;
 * after each commit the count is published and waiters are woken.
 */
const WRITER = `
const { workerData } = require('node:worker_threads');
const Database = require(workerData.driver);
const db = new Database(workerData.path);
db.pragma('busy_timeout = 5000');
const insert = db.prepare("insert into team (id, name, kind) values (?, ?, 'client')");
const state = new Int32Array(workerData.state);
while (Atomics.load(state, 1) === 0) {
	const n = Atomics.load(state, 0) + 1;
	insert.run(loadTeamId(n), 'Load team ' + n);
	Atomics.store(state, 0, n);
	Atomics.notify(state, 0);
}
db.close();
${loadTeamId.toString()}
`;

/** A thread that inserts teams into the database at `path` until stopped. */
export function startTeamWriter(path: string) {
	const state = new Int32Array(new SharedArrayBuffer(8));
	const worker = new Worker(WRITER, {
		eval: true,
		workerData: {
			path,
			driver: createRequire(import.meta.url).resolve('better-sqlite3'),
			state: state.buffer
		}
	});
	const exited = new Promise<number>((resolve, reject) => {
		worker.once('exit', resolve);
		worker.once('error', reject);
	});
	// Reported by stop(); a writer that dies early shows up as a stall first.
	exited.catch(() => undefined);
	return {
		written: () => Atomics.load(state, 0),
		/** Blocks until the writer has committed past `count`, or the timeout passes. */
		waitPast(count: number, timeout_ms = 5_000): void {
			const deadline = Date.now() + timeout_ms;
			while (Atomics.load(state, 0) <= count && Date.now() < deadline)
				Atomics.wait(state, 0, Atomics.load(state, 0), deadline - Date.now());
			if (Atomics.load(state, 0) <= count) throw new Error('The writer stalled.');
		},
		async stop(): Promise<void> {
			Atomics.store(state, 1, 1);
			await exited;
		}
	};
}
