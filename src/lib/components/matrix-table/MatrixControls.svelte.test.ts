import { cleanup, render, screen } from '@testing-library/svelte';
import userEvent from '@testing-library/user-event';
import { flushSync } from 'svelte';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { matrixColumns } from './columns';
import { planColumns } from './columnar';
import { fixturePlan } from './matrix-fixture';
import MatrixControls from './MatrixControls.svelte';
import { matrixFilterOptions } from './point-filter';
import { createSvelteTable } from './table.svelte';
import { matrixTableOptions } from './table-options';

const SEARCH_WAIT_MS = 150;

function setup() {
	const columns = matrixColumns(() => ({}));
	const table = createSvelteTable(matrixTableOptions(columns));
	const onViewChange = vi.fn();
	const filterOptions = matrixFilterOptions(planColumns(fixturePlan({ rows: 1, columns: 1 })));
	const view = render(MatrixControls, { props: { table, columns, filterOptions, onViewChange } });
	const user = userEvent.setup({ advanceTimers: (ms) => vi.advanceTimersByTime(ms) });
	return { table, onViewChange, view, user };
}

describe('MatrixControls', () => {
	beforeEach(() => {
		vi.useFakeTimers();
	});
	afterEach(() => {
		cleanup();
		vi.useRealTimers();
	});

	it('searches once, for the last text, after the typing pauses', async () => {
		const { table, onViewChange, user } = setup();
		await user.type(screen.getByLabelText('Search all columns'), ' spoiler');
		vi.advanceTimersByTime(SEARCH_WAIT_MS - 1);
		flushSync();
		expect(table.getState().globalFilter).toBeUndefined();
		vi.advanceTimersByTime(1);
		flushSync();
		expect(table.getState().globalFilter).toBe('spoiler');
		expect(onViewChange).toHaveBeenCalledTimes(1);
	});

	it('drops a search still waiting when the controls go away', async () => {
		const { table, onViewChange, view, user } = setup();
		await user.type(screen.getByLabelText('Search all columns'), 'spoiler');
		view.unmount();
		vi.advanceTimersByTime(10 * SEARCH_WAIT_MS);
		flushSync();
		expect(table.getState().globalFilter).toBeUndefined();
		expect(onViewChange).not.toHaveBeenCalled();
	});

	it('filters by configuration at once and collapses groups when the grouping changes', async () => {
		const { table, onViewChange, user } = setup();
		await user.selectOptions(screen.getByRole('combobox', { name: 'Configuration' }), 'spoiler');
		expect(table.getState().columnFilters).toEqual([{ id: 'configurationId', value: 'spoiler' }]);
		table.setExpanded(true);
		await user.selectOptions(screen.getByRole('combobox', { name: 'Group by' }), 'planeId');
		expect(table.getState().grouping).toEqual(['planeId']);
		expect(table.getState().expanded).toEqual({});
		expect(onViewChange).toHaveBeenCalledTimes(2);
	});
});
