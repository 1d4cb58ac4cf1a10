import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { debounce } from './debounce';

describe('debounce', () => {
	beforeEach(() => {
		vi.useFakeTimers();
	});
	afterEach(() => {
		vi.useRealTimers();
	});

	it('acts once, with the last arguments, after the calls pause', () => {
		const calls: string[] = [];
		const search = debounce((term: string) => calls.push(term), 150);
		search('s');
		vi.advanceTimersByTime(100);
		search('sp');
		vi.advanceTimersByTime(100);
		search('spo');
		vi.advanceTimersByTime(149);
		expect(calls).toEqual([]);
		vi.advanceTimersByTime(1);
		expect(calls).toEqual(['spo']);
	});

	it('drops a pending call when cancelled', () => {
		const calls: string[] = [];
		const search = debounce((term: string) => calls.push(term), 150);
		search('spoiler');
		search.cancel();
		vi.advanceTimersByTime(1_000);
		expect(calls).toEqual([]);
	});
});
