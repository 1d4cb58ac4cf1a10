import { z } from 'zod';

/** `?from=&to=` of a calendar request; a week from now when absent, at most a year long. */
export const rangeQuery = z
	.object({ from: z.coerce.date().optional(), to: z.coerce.date().optional() })
	.transform(({ from, to }) => {
		const start = from ?? new Date();
		return { from: start, to: to ?? new Date(start.getTime() + 7 * 86_400_000) };
	})
	.refine((r) => r.to > r.from && r.to.getTime() - r.from.getTime() <= 366 * 86_400_000, {
		error: 'Ask for a range that ends after it starts and spans at most a year.'
	});
