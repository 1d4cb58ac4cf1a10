import {
	createTable,
	type RowData,
	type Table,
	type TableOptions,
	type TableOptionsResolved,
	type TableState,
	type Updater
} from '@tanstack/table-core';

/**
 * Copies property descriptors rather than values, so an option given as a getter (`get data()`)
 * stays a getter and table-core reads the caller's current reactive value each time.
 */
function mergeDescriptors<T extends object>(...sources: object[]): T {
	const target = {};
	for (const source of sources) {
		Object.defineProperties(target, Object.getOwnPropertyDescriptors(source));
	}
	return target as T;
}

/**
 * A table-core table whose state lives in Svelte state. table-core reads its state through
 * `getState()`, which reads the rune, so any template or `$derived` that asks the table for rows,
 * headers or sorting re-runs when the state changes, and only then.
 *
 * The state is `$state.raw`: table-core's memos compare their inputs by identity and replace state
 * slices wholesale, so a deep proxy would only add cost on every read of 50 000 rows' state.
 */
export function createSvelteTable<TData extends RowData>(
	options: TableOptions<TData>
): Table<TData> {
	const resolved = mergeDescriptors<TableOptionsResolved<TData>>(
		{
			state: {},
			onStateChange: () => {},
			renderFallbackValue: null,
			mergeOptions: (defaults: object, given: object) => mergeDescriptors(defaults, given)
		},
		options
	);
	const table = createTable(resolved);
	let state = $state.raw<TableState>(table.initialState);

	table.setOptions((previous) =>
		mergeDescriptors(previous, options, {
			get state() {
				return state;
			},
			onStateChange(updater: Updater<TableState>) {
				state = typeof updater === 'function' ? updater(state) : updater;
				options.onStateChange?.(updater);
			}
		})
	);
	return table;
}
