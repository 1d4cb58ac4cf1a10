import { describe, expect, it } from 'vitest';
import { groupingFor } from './group-by';
import { expandMatrix } from '$lib/calc';
import { FIXTURE_SPEEDS_MPS, fixturePlan, headlessMatrixTable } from './matrix-fixture';

// 5 × 4 probes a plane: 2 000 points, so that the counts below are easy to check by hand.
const plan = fixturePlan({ rows: 5, columns: 4 });
const rows = expandMatrix(plan);

describe('sorting', () => {
	it('puts the fastest points first when sorted by speed descending, in run order within', () => {
		const { table, listedPoints } = headlessMatrixTable(plan);
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		const sorted = listedPoints();
		expect(sorted).toHaveLength(2_000);
		expect(sorted.slice(0, 400).every((r) => r.speed_mps === 40)).toBe(true);
		expect(sorted[400]!.speed_mps).toBe(35);
		expect(sorted.at(-1)!.speed_mps).toBe(20);
		const fastest = sorted.slice(0, 400).map((r) => r.point);
		expect(fastest).toEqual([...fastest].sort((a, b) => a - b));
	});

	it('sorts by a second column among equal values of the first', () => {
		const { table, listedPoints } = headlessMatrixTable(plan);
		table.setSorting([
			{ id: 'yaw_deg', desc: false },
			{ id: 'speed_mps', desc: true }
		]);
		const sorted = listedPoints();
		expect(sorted[0]).toMatchObject({ yaw_deg: -10, speed_mps: 40 });
		expect(sorted[79]).toMatchObject({ yaw_deg: -10, speed_mps: 40 });
		expect(sorted[80]).toMatchObject({ yaw_deg: -10, speed_mps: 35 });
		expect(sorted[400]).toMatchObject({ yaw_deg: -5, speed_mps: 40 });
	});

	it('goes back to run order when the sort is cleared', () => {
		const { table, listedPoints } = headlessMatrixTable(plan);
		table.setSorting([{ id: 'point', desc: true }]);
		expect(listedPoints()[0]!.point).toBe(2_000);
		table.setSorting([]);
		expect(listedPoints().map((r) => r.point)).toEqual(rows.map((r) => r.point));
	});

	it('sorts configurations by the label shown, numbers in labels by value', () => {
		const labels = { configurations: { baseline: 'Config 10', spoiler: 'Config 9' } };
		const { table, listedPoints } = headlessMatrixTable(plan, labels);
		table.setSorting([{ id: 'configurationId', desc: false }]);
		const sorted = listedPoints();
		expect(sorted[0]!.configurationId).toBe('spoiler');
		expect(sorted.at(-1)!.configurationId).toBe('baseline');
	});

	it('keeps run order between labels that read the same', () => {
		const labels = { configurations: { baseline: 'Wing', spoiler: 'wing' } };
		const { table, listedPoints } = headlessMatrixTable(plan, labels);
		table.setSorting([{ id: 'configurationId', desc: true }]);
		expect(listedPoints().map((r) => r.point)).toEqual(rows.map((r) => r.point));
	});
});

describe('filtering', () => {
	it('leaves only the chosen configuration', () => {
		const { table, listedPoints, view } = headlessMatrixTable(plan);
		table.getColumn('configurationId')!.setFilterValue('spoiler');
		const shown = listedPoints();
		expect(shown).toHaveLength(1_000);
		expect(view.shown).toHaveLength(1_000);
		expect(shown.every((r) => r.configurationId === 'spoiler')).toBe(true);
	});

	it('combines the configuration and plane filters, and clears one with an empty value', () => {
		const { table, listedPoints } = headlessMatrixTable(plan);
		table.getColumn('configurationId')!.setFilterValue('baseline');
		table.getColumn('planeId')!.setFilterValue('wake-far');
		expect(listedPoints()).toHaveLength(500);
		table.getColumn('planeId')!.setFilterValue('');
		expect(table.getState().columnFilters).toEqual([{ id: 'configurationId', value: 'baseline' }]);
		expect(listedPoints()).toHaveLength(1_000);
	});

	it('leaves nothing for a configuration the matrix does not have', () => {
		const { table, listedPoints } = headlessMatrixTable(plan);
		table.getColumn('configurationId')!.setFilterValue('flap');
		expect(listedPoints()).toEqual([]);
	});

	it('matches the search against the text each cell shows', () => {
		const { table, columns, listedPoints } = headlessMatrixTable(plan);
		const term = '39.04';
		const expected = rows.filter((r) =>
			columns.some((c) => c.format(r[c.id]).toLowerCase().includes(term))
		);
		table.setGlobalFilter(term);
		const shown = listedPoints();
		expect(shown).toEqual(expected);
		expect(shown).toHaveLength(400);
		expect(shown.every((r) => r.speed_mps === 25)).toBe(true);
	});

	it('matches a point number and a run number as well as a shared value', () => {
		const { table, columns, listedPoints } = headlessMatrixTable(plan);
		const term = '1999';
		table.setGlobalFilter(term);
		expect(listedPoints()).toEqual(
			rows.filter((r) => columns.some((c) => c.format(r[c.id]).toLowerCase().includes(term)))
		);
		expect(listedPoints().map((r) => r.point)).toEqual([1_999]);
	});

	it('finds configurations by their label, ignoring case and surrounding spaces', () => {
		const { table, listedPoints } = headlessMatrixTable(plan, {
			configurations: { spoiler: 'Rear Spoiler' }
		});
		table.setGlobalFilter('  rear spoiler ');
		const shown = listedPoints();
		expect(shown).toHaveLength(1_000);
		expect(shown.every((r) => r.configurationId === 'spoiler')).toBe(true);
	});

	it('searches labels as they are now, after a rename', () => {
		const labels = { configurations: { spoiler: 'Rear spoiler' } };
		const { table, listedPoints } = headlessMatrixTable(plan, labels);
		table.setGlobalFilter('rear');
		expect(listedPoints()).toHaveLength(1_000);
		labels.configurations = { spoiler: 'Gurney flap' };
		table.setGlobalFilter('gurney');
		expect(listedPoints()).toHaveLength(1_000);
		table.setGlobalFilter('rear');
		expect(listedPoints()).toHaveLength(0);
	});

	it('shows nothing for a term no cell contains', () => {
		const { table, listedPoints } = headlessMatrixTable(plan);
		table.setGlobalFilter('no such point');
		expect(listedPoints()).toHaveLength(0);
	});
});

describe('grouping', () => {
	it('yields one collapsed group per plane with its point count', () => {
		const { table, view } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('planeId'));
		expect(Array.from(view.lines)).toEqual([-1, -2]);
		expect(view.groups.map((g) => [g.id, g.points.length])).toEqual([
			['planeId:wake-near', 1_000],
			['planeId:wake-far', 1_000]
		]);
	});

	it('lists a group’s points under it once expanded', () => {
		const { table, view, listedPoints } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('planeId'));
		table.setExpanded({ 'planeId:wake-far': true });
		expect(view.lines).toHaveLength(2 + 1_000);
		expect(Array.from(view.lines.subarray(0, 2))).toEqual([-1, -2]);
		expect(listedPoints().every((r) => r.planeId === 'wake-far')).toBe(true);
	});

	it('counts only the points the filters leave', () => {
		const { table, view, matrix } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('speed_mps'));
		table.getColumn('configurationId')!.setFilterValue('baseline');
		table.getColumn('planeId')!.setFilterValue('wake-near');
		const speeds = view.groups.map((g) => matrix.values.speed_mps[g.first]);
		expect(speeds).toEqual(FIXTURE_SPEEDS_MPS);
		expect(view.groups.map((g) => g.points.length)).toEqual([100, 100, 100, 100, 100]);
	});

	it('orders groups by the grouped column when it is sorted', () => {
		const { table, view, matrix } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('speed_mps'));
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		expect(view.groups.map((g) => matrix.values.speed_mps[g.first])).toEqual([40, 35, 30, 25, 20]);
	});

	it('keeps groups in run order and sorts inside them by another column', () => {
		const { table, view, listedPoints } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('planeId'));
		table.setSorting([{ id: 'speed_mps', desc: true }]);
		table.setExpanded(true);
		expect(view.lines[0]).toBe(-1);
		expect(view.lines[1_001]).toBe(-2);
		expect(view.groups.map((g) => g.id)).toEqual(['planeId:wake-near', 'planeId:wake-far']);
		const shown = listedPoints();
		expect(shown[0]!.speed_mps).toBe(40);
		expect(shown[999]).toMatchObject({ planeId: 'wake-near', speed_mps: 20 });
		expect(shown[1_000]).toMatchObject({ planeId: 'wake-far', speed_mps: 40 });
	});

	it('does not rank groups by a total of the sorted column', () => {
		const { table, view, matrix } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('speed_mps'));
		table.setSorting([{ id: 'point', desc: true }]);
		expect(view.groups.map((g) => matrix.values.speed_mps[g.first])).toEqual(FIXTURE_SPEEDS_MPS);
		const slowest = view.groups[0]!.points.map((p) => rows[p]!.point);
		expect(slowest[0]).toBe(
			Math.max(...rows.filter((r) => r.speed_mps === 20).map((r) => r.point))
		);
		expect(slowest).toEqual([...slowest].sort((a, b) => b - a));
	});
});
