import { describe, expect, it } from 'vitest';
import { DEFAULT_BODY_SIZE_LIMIT, securityHeaders } from '../../scripts/serve-config.js';
import { UPLOAD_LIMITS } from '../../src/lib/server/body-limits';

/** BODY_SIZE_LIMIT as adapter-node reads it: a number of bytes, or K, M, G as powers of 1024. */
function adapterBytes(limit: string): number {
	const multiplier = { K: 1024, M: 1024 ** 2, G: 1024 ** 3 }[limit.at(-1)!.toUpperCase()];
	return multiplier ? Number(limit.slice(0, -1)) * multiplier : Number(limit);
}

describe('the production start', () => {
	it('reads every body a route of the product accepts', () => {
		expect(adapterBytes(DEFAULT_BODY_SIZE_LIMIT)).toBeGreaterThanOrEqual(
			Math.max(...UPLOAD_LIMITS.values())
		);
	});

	it('promises HSTS only to an https origin', () => {
		const names = (origin?: string) => securityHeaders(origin).map(([name]) => name);
		expect(names('https://tunnels.example.org')).toContain('strict-transport-security');
		expect(names('http://localhost:3000')).not.toContain('strict-transport-security');
		expect(names(undefined)).not.toContain('strict-transport-security');
	});
});
