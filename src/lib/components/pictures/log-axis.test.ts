import { describe, expect, it } from 'vitest';
import { labelledLogTicks, logDomain } from './log-axis';

describe('log domain', () => {
	it('adds the margin as a fraction of the span in decades', () => {
		const [lo, hi] = logDomain([1e5, 3e6, 1e7], 0.08);
		expect(Math.log10(lo)).toBeCloseTo(4.84, 12);
		expect(Math.log10(hi)).toBeCloseTo(7.16, 12);
	});

	it('widens a narrow range to one decade about its middle before the margin', () => {
		const [lo, hi] = logDomain([2e4, 3e4], 0.08);
		expect(Math.log10(hi / lo)).toBeCloseTo(1.16, 12);
		expect(Math.sqrt(lo * hi)).toBeCloseTo(Math.sqrt(2e4 * 3e4), 6);
	});

	it('ignores missing and non-positive values', () => {
		const [lo, hi] = logDomain([NaN, 0, -5, 1e6], 0);
		expect(lo).toBeCloseTo(10 ** 5.5, 6);
		expect(hi).toBeCloseTo(10 ** 6.5, 6);
	});

	it('refuses a range with nothing to plot', () => {
		expect(() => logDomain([0, NaN])).toThrow(RangeError);
	});
});

describe('labelled log ticks', () => {
	it('labels the 1-2-5 series over two decades', () => {
		const ticks = [
			3e5, 4e5, 5e5, 6e5, 7e5, 8e5, 9e5, 1e6, 2e6, 3e6, 4e6, 5e6, 6e6, 7e6, 8e6, 9e6, 1e7, 2e7
		];
		expect(labelledLogTicks(ticks)).toEqual([5e5, 1e6, 2e6, 5e6, 1e7, 2e7]);
	});

	it('falls back to powers of ten over many decades', () => {
		const ticks = [4, 5, 6, 7, 8].flatMap((e) =>
			[1, 2, 3, 4, 5, 6, 7, 8, 9].map((m) => m * 10 ** e)
		);
		ticks.push(1e9);
		expect(labelledLogTicks(ticks)).toEqual([1e4, 1e5, 1e6, 1e7, 1e8, 1e9]);
	});

	it('labels every tick when there are few', () => {
		expect(labelledLogTicks([1e5, 1e6, 1e7])).toEqual([1e5, 1e6, 1e7]);
	});
});
