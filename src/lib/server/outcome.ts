/** Expected failures of a domain operation, named so routes can map them to HTTP statuses. */
export type Refusal = {
	ok: false;
	code: 'not-found' | 'conflict' | 'forbidden' | 'invalid';
	message: string;
	field?: string;
};
export type Outcome<T = object> = ({ ok: true } & T) | Refusal;

export function refuse(code: Refusal['code'], message: string, field?: string): Refusal {
	return { ok: false, code, message, ...(field ? { field } : {}) };
}

export const STATUS_OF_REFUSAL = {
	invalid: 400,
	forbidden: 403,
	'not-found': 404,
	conflict: 409
} as const satisfies Record<Refusal['code'], number>;
