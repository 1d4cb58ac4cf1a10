export type Debounced<A extends unknown[]> = {
	(...args: A): void;
	cancel: () => void;
};

/** Calls `action` once the calls have paused for `wait_ms`, with the last call's arguments. */
export function debounce<A extends unknown[]>(
	action: (...args: A) => void,
	wait_ms: number
): Debounced<A> {
	let timer: ReturnType<typeof setTimeout> | undefined;
	const debounced = (...args: A) => {
		clearTimeout(timer);
		timer = setTimeout(() => {
			timer = undefined;
			action(...args);
		}, wait_ms);
	};
	debounced.cancel = () => {
		clearTimeout(timer);
		timer = undefined;
	};
	return debounced;
}
