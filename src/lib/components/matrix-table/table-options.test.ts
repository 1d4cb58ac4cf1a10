import { describe, expect, it } from 'vitest';
import { fixturePlan, headlessMatrixTable } from './matrix-fixture';

const plan = fixturePlan({ rows: 2, columns: 2 });

describe('matrixTableOptions', () => {
	it('starts a clicked column ascending, then descending, then back to run order', () => {
		const { table } = headlessMatrixTable(plan);
		const speed = table.getColumn('speed_mps')!;
		speed.toggleSorting(undefined, false);
		expect(table.getState().sorting).toEqual([{ id: 'speed_mps', desc: false }]);
		speed.toggleSorting(undefined, false);
		expect(table.getState().sorting).toEqual([{ id: 'speed_mps', desc: true }]);
		speed.toggleSorting(undefined, false);
		expect(table.getState().sorting).toEqual([]);
	});

	it('adds a column to the sort when the click is a multi-sort one', () => {
		const { table } = headlessMatrixTable(plan);
		table.getColumn('planeId')!.getToggleSortingHandler()!({ shiftKey: false });
		table.getColumn('mach')!.getToggleSortingHandler()!({ shiftKey: true });
		expect(table.getState().sorting).toEqual([
			{ id: 'planeId', desc: false },
			{ id: 'mach', desc: false }
		]);
		expect(table.getColumn('mach')!.getSortIndex()).toBe(1);
	});

	it('lets every column but the point number be hidden', () => {
		const { table } = headlessMatrixTable(plan);
		const hideable = table.getAllLeafColumns().filter((c) => c.getCanHide());
		expect(table.getAllLeafColumns()).toHaveLength(17);
		expect(hideable).toHaveLength(16);
		table.getColumn('mach')!.toggleVisibility(false);
		expect(table.getVisibleLeafColumns().map((c) => c.id)).not.toContain('mach');
		expect(table.getVisibleLeafColumns()).toHaveLength(16);
	});

	it('keeps open groups open while the filters change', () => {
		const { table } = headlessMatrixTable(plan);
		table.setGrouping(['planeId']);
		table.setExpanded({ 'planeId:wake-far': true });
		table.getColumn('configurationId')!.setFilterValue('spoiler');
		table.setGlobalFilter('25');
		expect(table.getState().expanded).toEqual({ 'planeId:wake-far': true });
	});

	it('builds no row objects for the points', () => {
		const { table } = headlessMatrixTable(plan);
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		expect(table.getRowModel().rows).toEqual([]);
	});
});
