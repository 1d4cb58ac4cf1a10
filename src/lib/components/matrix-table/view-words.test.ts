import { describe, expect, it } from 'vitest';
import { matrixColumns } from './columns';
import { groupByOf, groupingFor, toGroupBy } from './group-by';
import { describeView } from './view-words';

const columns = matrixColumns(() => ({}));

describe('describeView', () => {
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

describe('group choices', () => {
	it('reads group choices back from select values and the table state', () => {
		expect(groupingFor('none')).toEqual([]);
		expect(groupingFor('speed_mps')).toEqual(['speed_mps']);
		expect(groupByOf(['planeId'])).toBe('planeId');
		expect(groupByOf([])).toBe('none');
		expect(toGroupBy('run')).toBe('none');
	});
});
