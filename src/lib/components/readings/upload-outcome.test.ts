import { describe, expect, it } from 'vitest';
import { stageFraction, uploadOutcome } from './upload-outcome';

describe('the page’s words for an upload', () => {
	it('says what was stored and replaced', () => {
		const body = { upload: { readingCount: 12_000, runCount: 3, replacedCount: 1500 } };
		expect(uploadOutcome({ status: 201, body })).toEqual({
			ok: true,
			message: 'Stored 12,000 readings in 3 run(s), replacing 1,500.'
		});
	});

	it('passes on the problems, and the points already read on a conflict', () => {
		const problems = [{ row: 3, column: 'reading', reason: 'is required' }];
		expect(
			uploadOutcome({ status: 400, body: { error: { message: 'bad', problems, problemCount: 7 } } })
		).toEqual({ ok: false, message: 'bad', problems, problemCount: 7, conflictPoints: undefined });
		expect(
			uploadOutcome({ status: 409, body: { error: { message: 'already', points: [4, 5] } } })
				.conflictPoints
		).toEqual([4, 5]);
		expect(uploadOutcome({ status: 502, body: {} }).message).toBe('The server answered 502.');
	});

	it('moves the bar through each stage', () => {
		expect(stageFraction(null)).toBe(0);
		expect(stageFraction({ stage: 'sending', fraction: 0.25 })).toBe(0.25);
		expect(stageFraction({ stage: 'check', done: 5000, total: 20_000 })).toBe(0.25);
		expect(stageFraction({ stage: 'store', done: 0, total: 0 })).toBe(0);
	});
});
