import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
	export interface ProvidedContext {
		baseUrl: string;
		databasePath: string;
	}
}

function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const probe = createServer();
		probe.once('error', reject);
		probe.listen(0, '127.0.0.1', () => {
			const address = probe.address();
			probe.close(() =>
				typeof address === 'object' && address ? resolve(address.port) : reject()
			);
		});
	});
}

async function waitUntilServing(url: string, server: ChildProcess, timeout_ms: number) {
	const deadline = Date.now() + timeout_ms;
	while (Date.now() < deadline) {
		if (server.exitCode !== null) throw new Error(`The app exited with code ${server.exitCode}`);
		try {
			const response = await fetch(url, { redirect: 'manual' });
			if (response.status < 500) return;
		} catch {
			// not listening yet
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	throw new Error(`The app did not answer at ${url} within ${timeout_ms} ms`);
}

/** Starts the built app on a free port with a freshly seeded database of its own. */
export default async function setup(project: TestProject) {
	if (!existsSync('build/index.js'))
		throw new Error('Run `vite build` before the end-to-end tests.');
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-e2e-'));
	const databasePath = join(dir, 'e2e.db');
	const env = { ...process.env, DATABASE_URL: databasePath };
	execFileSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], { env, stdio: 'inherit' });

	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const server = spawn(process.execPath, ['build'], {
		env: {
			...env,
			HOST: '127.0.0.1',
			PORT: String(port),
			ORIGIN: baseUrl,
			AUTH_SECRET: randomBytes(32).toString('base64url')
		},
		stdio: ['ignore', 'inherit', 'inherit']
	});
	await waitUntilServing(`${baseUrl}/signin`, server, 30_000);
	project.provide('baseUrl', baseUrl);
	project.provide('databasePath', databasePath);

	return async () => {
		server.kill('SIGTERM');
		await new Promise((r) => server.once('exit', r));
		rmSync(dir, { recursive: true, force: true });
	};
}
