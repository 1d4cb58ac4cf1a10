import type { ReceivePhase } from '$lib/readings/types';

/** What the page shows while a readings file travels and is processed. */
export type UploadStage =
	{ stage: 'sending'; fraction: number } | { stage: ReceivePhase; done: number; total: number };

export type UploadResult = { status: number; body: Record<string, unknown> };

/**
 * Posts a readings file to the API and reports progress: the browser's upload progress while the
 * bytes travel, then the server's progress lines (NDJSON) while it parses, checks and stores.
 * XMLHttpRequest, because fetch reports no upload progress.
 */
export function sendReadings(
	campaignId: string,
	file: File,
	replace: boolean,
	onStage: (stage: UploadStage) => void
): Promise<UploadResult> {
	return new Promise((resolve, reject) => {
		const xhr = new XMLHttpRequest();
		const mediaType =
			file.type === 'application/json' || file.name.toLowerCase().endsWith('.json')
				? 'application/json'
				: 'text/csv';
		xhr.open('POST', `/api/v1/campaigns/${campaignId}/readings${replace ? '?replace=true' : ''}`);
		xhr.setRequestHeader('content-type', mediaType);
		xhr.setRequestHeader('accept', 'application/x-ndjson');
		xhr.setRequestHeader('x-file-name', encodeURIComponent(file.name));
		xhr.upload.onprogress = (e) => {
			if (e.lengthComputable) onStage({ stage: 'sending', fraction: e.loaded / e.total });
		};
		let seen = 0;
		let result: UploadResult | null = null;
		const readLines = () => {
			const text = xhr.responseText;
			const end = text.lastIndexOf('\n');
			if (end < seen) return;
			for (const line of text.slice(seen, end).split('\n')) {
				if (!line.trim()) continue;
				const message = JSON.parse(line);
				if (message.type === 'progress') onStage(message);
				else if (message.type === 'result') result = { status: message.status, body: message.body };
			}
			seen = end + 1;
		};
		xhr.onprogress = readLines;
		xhr.onload = () => {
			if (xhr.getResponseHeader('content-type')?.startsWith('application/x-ndjson')) {
				readLines();
				if (result) return resolve(result);
			}
			// Refused before processing began (size, media type, sign-in): a plain JSON error.
			let body: Record<string, unknown>;
			try {
				body = JSON.parse(xhr.responseText);
			} catch {
				body = { error: { message: `The server answered ${xhr.status}.` } };
			}
			resolve({ status: xhr.status, body });
		};
		xhr.onerror = () => reject(new Error('The upload did not reach the server.'));
		xhr.send(file);
	});
}
