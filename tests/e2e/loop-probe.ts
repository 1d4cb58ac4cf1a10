import { Worker } from 'node:worker_threads';

export type LoopProbe = {
	/** Stops probing and gives the longest wait a probe saw, in ms. */
	stop(): Promise<number>;
};

/**
 * Runs in a thread of its own, so that the test sending a large body (on the test's own event
 * loop) does not delay the probe and count against the app.
 */
const PROBE_THREAD = `
const { parentPort, workerData } = require('node:worker_threads');
const http = require('node:http');
let running = true;
let longest = 0;
parentPort.on('message', () => { running = false; });
function once() {
	const started = performance.now();
	return new Promise((resolve) => {
		const request = http.get(workerData.url, { agent: false }, (response) => {
			response.resume();
			response.on('end', resolve);
			response.on('error', resolve);
		});
		request.on('error', resolve);
	}).then(() => { longest = Math.max(longest, performance.now() - started); });
}
(async () => {
	parentPort.postMessage('started');
	while (running) await once();
	parentPort.postMessage(longest);
})();
`;

/**
 * Asks the app for a static file over and over, one request at a time, while something else is
 * being served. A probe waits as long as the app's event loop is held, so the longest wait is
 * what every other user of the server felt during that time.
 */
export async function probeEventLoop(baseUrl: string): Promise<LoopProbe> {
	const worker = new Worker(PROBE_THREAD, {
		eval: true,
		workerData: { url: new URL('/favicon.svg', baseUrl).href }
	});
	const messages: unknown[] = [];
	let notify = () => {};
	worker.on('message', (m) => {
		messages.push(m);
		notify();
	});
	const next = () =>
		new Promise<unknown>((resolve) => {
			if (messages.length) return resolve(messages.shift());
			notify = () => resolve(messages.shift());
		});
	await next();
	return {
		async stop() {
			worker.postMessage('stop');
			const longest_ms = Number(await next());
			await worker.terminate();
			return longest_ms;
		}
	};
}
