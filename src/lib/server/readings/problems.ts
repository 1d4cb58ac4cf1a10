import type { ReadingProblem } from '../../readings/types';

export const MAX_PROBLEMS_SHOWN = 100;

/**
 * The problems found in a file: every one is counted, the first hundred are kept to show, so a
 * file wrong on every row still answers quickly and briefly.
 */
export class ProblemList {
	readonly shown: ReadingProblem[] = [];
	count = 0;
	add(row: number | null, column: string | null, reason: string) {
		this.count++;
		if (this.shown.length < MAX_PROBLEMS_SHOWN) this.shown.push({ row, column, reason });
	}
	refusal() {
		return { ok: false as const, problems: this.shown, problemCount: this.count };
	}
}
