import type { ReadingProblem } from '$lib/readings/types';
import type { UploadResult, UploadStage } from './send-readings';

/** What the page says after an upload: stored, or why not, with the problems to fix. */
export type UploadOutcome = {
	ok: boolean;
	message: string;
	problems?: ReadingProblem[];
	problemCount?: number;
	/** Points already read, when the server refused to replace them without being asked. */
	conflictPoints?: number[];
};

type ErrorBody = {
	message?: string;
	problems?: ReadingProblem[];
	problemCount?: number;
	points?: number[];
};

const count = (n: number) => n.toLocaleString('en-GB');

/** The server's answer to a readings upload in the page's words. */
export function uploadOutcome({ status, body }: UploadResult): UploadOutcome {
	if (status === 201) {
		const u = body.upload as { readingCount: number; runCount: number; replacedCount: number };
		return {
			ok: true,
			message: `Stored ${count(u.readingCount)} readings in ${u.runCount} run(s)${u.replacedCount ? `, replacing ${count(u.replacedCount)}` : ''}.`
		};
	}
	const error = body.error as ErrorBody | undefined;
	return {
		ok: false,
		message: error?.message ?? `The server answered ${status}.`,
		problems: error?.problems,
		problemCount: error?.problemCount,
		conflictPoints: status === 409 ? (error?.points ?? []) : undefined
	};
}

/** How far along the current stage is, from 0 to 1, for the progress bar. */
export function stageFraction(stage: UploadStage | null): number {
	if (!stage) return 0;
	if (stage.stage === 'sending') return stage.fraction;
	return stage.total ? stage.done / stage.total : 0;
}
