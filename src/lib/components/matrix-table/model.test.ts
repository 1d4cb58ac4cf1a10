import { describe, expect, it } from 'vitest';
import type { MatrixRow } from '$lib/calc';
import { FIXTURE_SPEEDS_MPS, fixtureRows, headlessMatrixTable } from './matrix-fixture';
import { describeView, groupByOf, groupingFor, toGroupBy } from './model';

// 5 × 4 probes a plane: 2 000 points, so that the counts below are easy to check by hand.
const rows = fixtureRows({ rows: 5, columns: 4 });
const originals = (list: { original: MatrixRow }[]) => list.map((r) => r.original);

describe('sorting', () => {
	it('puts the fastest points first when sorted by speed descending, in run order within', () => {
		const { table } = headlessMatrixTable(rows);
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		const sorted = originals(table.getRowModel().rows);
		expect(sorted).toHaveLength(2_000);
		expect(sorted.slice(0, 400).every((r) => r.speed_mps === 40)).toBe(true);
		expect(sorted[400]!.speed_mps).toBe(35);
		expect(sorted.at(-1)!.speed_mps).toBe(20);
		const fastest = sorted.slice(0, 400).map((r) => r.point);
		expect(fastest).toEqual([...fastest].sort((a, b) => a - b));
	});

	it('sorts by a second column among equal values of the first', () => {
		const { table } = headlessMatrixTable(rows);
		table.setSorting([
			{ id: 'yaw_deg', desc: false },
			{ id: 'speed_mps', desc: true }
		]);
		const sorted = originals(table.getRowModel().rows);
		expect(sorted[0]).toMatchObject({ yaw_deg: -10, speed_mps: 40 });
		expect(sorted[79]).toMatchObject({ yaw_deg: -10, speed_mps: 40 });
		expect(sorted[80]).toMatchObject({ yaw_deg: -10, speed_mps: 35 });
		expect(sorted[400]).toMatchObject({ yaw_deg: -5, speed_mps: 40 });
	});

	it('starts a clicked column ascending, then descending, then back to run order', () => {
		const { table } = headlessMatrixTable(rows);
		const speed = table.getColumn('speed_mps')!;
		speed.toggleSorting(undefined, false);
		expect(table.getState().sorting).toEqual([{ id: 'speed_mps', desc: false }]);
		speed.toggleSorting(undefined, false);
		expect(table.getState().sorting).toEqual([{ id: 'speed_mps', desc: true }]);
		speed.toggleSorting(undefined, false);
		expect(table.getState().sorting).toEqual([]);
		expect(table.getRowModel().rows[0]!.original.point).toBe(1);
	});

	it('adds a column to the sort when the click is a multi-sort one', () => {
		const { table } = headlessMatrixTable(rows);
		table.getColumn('planeId')!.getToggleSortingHandler()!({ shiftKey: false });
		table.getColumn('mach')!.getToggleSortingHandler()!({ shiftKey: true });
		expect(table.getState().sorting).toEqual([
			{ id: 'planeId', desc: false },
			{ id: 'mach', desc: false }
		]);
	});

	it('sorts configurations by the label shown, numbers in labels by value', () => {
		const labels = { configurations: { baseline: 'Config 10', spoiler: 'Config 9' } };
		const { table } = headlessMatrixTable(rows, labels);
		table.setSorting([{ id: 'configurationId', desc: false }]);
		const sorted = originals(table.getRowModel().rows);
		expect(sorted[0]!.configurationId).toBe('spoiler');
		expect(sorted.at(-1)!.configurationId).toBe('baseline');
	});
});

describe('filtering', () => {
	it('leaves only the chosen configuration', () => {
		const { table } = headlessMatrixTable(rows);
		table.getColumn('configurationId')!.setFilterValue('spoiler');
		const shown = originals(table.getRowModel().rows);
		expect(shown).toHaveLength(1_000);
		expect(shown.every((r) => r.configurationId === 'spoiler')).toBe(true);
	});

	it('combines the configuration and plane filters, and clears one with an empty value', () => {
		const { table } = headlessMatrixTable(rows);
		table.getColumn('configurationId')!.setFilterValue('baseline');
		table.getColumn('planeId')!.setFilterValue('wake-far');
		expect(table.getRowModel().rows).toHaveLength(500);
		table.getColumn('planeId')!.setFilterValue(undefined);
		expect(table.getState().columnFilters).toEqual([{ id: 'configurationId', value: 'baseline' }]);
		expect(table.getRowModel().rows).toHaveLength(1_000);
	});

	it('matches the search against the text each cell shows', () => {
		const { table, columns } = headlessMatrixTable(rows);
		const term = '39.04';
		const expected = rows.filter((r) =>
			columns.some((c) => c.format(r[c.id]).toLowerCase().includes(term))
		);
		table.setGlobalFilter(term);
		const shown = originals(table.getRowModel().rows);
		expect(shown).toEqual(expected);
		expect(shown).toHaveLength(400);
		expect(shown.every((r) => r.speed_mps === 25)).toBe(true);
	});

	it('finds configurations by their label, ignoring case and surrounding spaces', () => {
		const { table } = headlessMatrixTable(rows, { configurations: { spoiler: 'Rear Spoiler' } });
		table.setGlobalFilter('  rear spoiler ');
		const shown = originals(table.getRowModel().rows);
		expect(shown).toHaveLength(1_000);
		expect(shown.every((r) => r.configurationId === 'spoiler')).toBe(true);
	});

	it('searches labels as they are now, after a rename', () => {
		const labels = { configurations: { spoiler: 'Rear spoiler' } };
		const { table } = headlessMatrixTable(rows, labels);
		table.setGlobalFilter('rear');
		expect(table.getRowModel().rows).toHaveLength(1_000);
		labels.configurations = { spoiler: 'Gurney flap' };
		table.setGlobalFilter('gurney');
		expect(table.getRowModel().rows).toHaveLength(1_000);
		table.setGlobalFilter('rear');
		expect(table.getRowModel().rows).toHaveLength(0);
	});

	it('shows nothing for a term no cell contains', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGlobalFilter('no such point');
		expect(table.getRowModel().rows).toHaveLength(0);
	});
});

describe('grouping', () => {
	it('yields one collapsed group per plane with its point count', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGrouping(groupingFor('planeId'));
		const groups = table.getRowModel().rows;
		expect(groups.map((g) => [g.getIsGrouped(), g.groupingValue, g.subRows.length])).toEqual([
			[true, 'wake-near', 1_000],
			[true, 'wake-far', 1_000]
		]);
	});

	it('lists a group’s points under it once expanded', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGrouping(groupingFor('planeId'));
		table.getRowModel().rows[1]!.toggleExpanded(true);
		const shown = table.getRowModel().rows;
		expect(shown).toHaveLength(2 + 1_000);
		expect(shown[0]!.getIsGrouped()).toBe(true);
		expect(shown[1]!.getIsGrouped()).toBe(true);
		expect(shown.slice(2).every((r) => r.original.planeId === 'wake-far')).toBe(true);
	});

	it('counts only the points the filters leave', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGrouping(groupingFor('speed_mps'));
		table.getColumn('configurationId')!.setFilterValue('baseline');
		table.getColumn('planeId')!.setFilterValue('wake-near');
		const groups = table.getRowModel().rows;
		expect(groups.map((g) => g.original.speed_mps)).toEqual(FIXTURE_SPEEDS_MPS);
		expect(groups.map((g) => g.subRows.length)).toEqual([100, 100, 100, 100, 100]);
	});

	it('orders groups by the grouped column when it is sorted', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGrouping(groupingFor('speed_mps'));
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		expect(table.getRowModel().rows.map((g) => g.original.speed_mps)).toEqual([40, 35, 30, 25, 20]);
	});

	it('keeps groups in run order and sorts inside them by another column', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGrouping(groupingFor('planeId'));
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		table.setExpanded(true);
		const shown = table.getRowModel().rows;
		expect(shown[0]!.groupingValue).toBe('wake-near');
		expect(shown[1]!.original.speed_mps).toBe(40);
		expect(shown[1_000]!.original.speed_mps).toBe(20);
		expect(shown[1_001]!.groupingValue).toBe('wake-far');
		expect(shown[1_002]!.original.speed_mps).toBe(40);
	});

	it('does not rank groups by a total of the sorted column', () => {
		const { table } = headlessMatrixTable(rows);
		table.setGrouping(groupingFor('speed_mps'));
		table.setSorting([{ id: 'point', desc: true }]);
		const groups = table.getRowModel().rows;
		expect(groups.map((g) => g.original.speed_mps)).toEqual(FIXTURE_SPEEDS_MPS);
		const slowest = groups[0]!.subRows.map((r) => r.original.point);
		expect(slowest[0]).toBe(
			Math.max(...rows.filter((r) => r.speed_mps === 20).map((r) => r.point))
		);
		expect(slowest).toEqual([...slowest].sort((a, b) => b - a));
	});

	it('reads group choices back from select values and the table state', () => {
		expect(groupingFor('none')).toEqual([]);
		expect(groupByOf(['planeId'])).toBe('planeId');
		expect(groupByOf([])).toBe('none');
		expect(toGroupBy('run')).toBe('none');
	});
});

describe('describeView', () => {
	const { columns } = headlessMatrixTable([]);

	it('says when the points are in run order and ungrouped', () => {
		expect(describeView([], [], columns)).toBe('in run order; not grouped');
	});

	it('names each sort key with its unit and direction, and the grouping', () => {
		const sorting = [
			{ id: 'speed_mps', desc: true },
			{ id: 'yaw_deg', desc: false }
		];
		expect(describeView(sorting, ['planeId'], columns)).toBe(
			'sorted by Speed (m/s) descending, then Yaw (°) ascending; grouped by plane'
		);
	});
});
