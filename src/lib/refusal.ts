/**
 * Expected failures of a domain operation or a workflow step, named so that only the edge
 * (routes and forms) chooses an HTTP status for them.
 */
export type Refusal = {
	ok: false;
	code: 'not-found' | 'conflict' | 'forbidden' | 'invalid' | 'stale';
	message: string;
	field?: string;
};
export type Outcome<T = object> = ({ ok: true } & T) | Refusal;

export function refuse(code: Refusal['code'], message: string, field?: string): Refusal {
	return { ok: false, code, message, ...(field ? { field } : {}) };
}
