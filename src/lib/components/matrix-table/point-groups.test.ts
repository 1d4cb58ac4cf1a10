import { describe, expect, it } from 'vitest';
import { groupingFor } from './group-by';
import { fixturePlan, headlessMatrixTable } from './matrix-fixture';
import { isExpanded, toggleGroup } from './point-groups';

const plan = fixturePlan({ rows: 2, columns: 2 });

describe('toggleGroup', () => {
	it('closes one group out of all open and leaves the others open', () => {
		const { table, view } = headlessMatrixTable(plan);
		table.setGrouping(groupingFor('configurationId'));
		table.setExpanded(true);
		const next = toggleGroup(true, 'configurationId:spoiler', view.groups);
		expect(next).toEqual({ 'configurationId:baseline': true, 'configurationId:spoiler': false });
		table.setExpanded(next);
		expect(Array.from(view.lines.subarray(0, 1))).toEqual([-1]);
		expect(view.lines.at(-1)).toBe(-2);
	});

	it('opens a closed group and closes it again', () => {
		const opened = toggleGroup({}, 'planeId:wake-far', []);
		expect(isExpanded(opened, 'planeId:wake-far')).toBe(true);
		expect(isExpanded(toggleGroup(opened, 'planeId:wake-far', []), 'planeId:wake-far')).toBe(false);
	});
});
