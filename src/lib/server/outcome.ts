import type { Refusal } from '../refusal';

export { refuse, type Outcome, type Refusal } from '../refusal';

/** The one place a refusal becomes an HTTP status. */
export const STATUS_OF_REFUSAL = {
	invalid: 400,
	forbidden: 403,
	'not-found': 404,
	conflict: 409,
	/** The writer named a version that is no longer the stored one (RFC 9110 §13.1.1, If-Match). */
	stale: 412
} as const satisfies Record<Refusal['code'], number>;
