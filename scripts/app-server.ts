/**
 * Starts the built app (adapter-node's build/) on a free loopback port with a freshly seeded
 * database of its own. Used by the end-to-end tests and the browser benchmarks.
 */
import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

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

export type RunningApp = {
	baseUrl: string;
	/** One address per server process, all on the same database; the first is `baseUrl`. */
	baseUrls: string[];
	databasePath: string;
	stop: () => Promise<void>;
};

/**
 * `processes` above 1 starts that many servers on the one database file, sharing the signing
 * secret, as a deployment with several processes on one host runs them.
 */
export async function startSeededApp({
	quiet = false,
	processes = 1
}: { quiet?: boolean; processes?: number } = {}): Promise<RunningApp> {
	if (!existsSync('build/index.js'))
		throw new Error('Run `vite build` first: build/index.js is missing.');
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-app-'));
	const databasePath = join(dir, 'app.db');
	const env = {
		...process.env,
		DATABASE_URL: databasePath,
		// Always the local fake, in the app's own folder, even where the shell names a bucket.
		S3_URL: '',
		LOCAL_S3_DIR: join(dir, 'object-store'),
		// Always the local payment stand-in, even where the shell names an account.
		STRIPE_SECRET_KEY: ''
	};
	execFileSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], {
		env,
		stdio: quiet ? 'ignore' : 'inherit'
	});

	const secret = randomBytes(32).toString('base64url');
	const servers: { baseUrl: string; server: ReturnType<typeof spawn> }[] = [];
	for (let i = 0; i < processes; i++) servers.push(await startServer(env, secret, quiet));

	return {
		baseUrl: servers[0]!.baseUrl,
		baseUrls: servers.map((s) => s.baseUrl),
		databasePath,
		stop: async () => {
			await Promise.all(
				servers.map(({ server }) => {
					server.kill('SIGTERM');
					return new Promise((r) => server.once('exit', r));
				})
			);
			rmSync(dir, { recursive: true, force: true });
		}
	};
}

async function startServer(env: NodeJS.ProcessEnv, secret: string, quiet: boolean) {
	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const server = spawn(process.execPath, ['scripts/serve.js'], {
		env: { ...env, HOST: '127.0.0.1', PORT: String(port), ORIGIN: baseUrl, AUTH_SECRET: secret },
		stdio: ['ignore', quiet ? 'ignore' : 'inherit', 'inherit']
	});

	const deadline = Date.now() + 30_000;
	for (;;) {
		if (server.exitCode !== null) throw new Error(`The app exited with code ${server.exitCode}`);
		const up = await fetch(`${baseUrl}/signin`, { redirect: 'manual' }).then(
			(r) => r.status < 500,
			() => false
		);
		if (up) break;
		if (Date.now() > deadline) throw new Error(`The app did not answer at ${baseUrl} within 30 s`);
		await new Promise((r) => setTimeout(r, 200));
	}
	return { baseUrl, server };
}
