/** Click-to-sort state for the small list tables (facilities, models, campaigns). */
export class ListSort<T> {
	key = $state<keyof T>() as keyof T;
	descending = $state(false);

	constructor(key: keyof T) {
		this.key = key;
	}

	toggle(key: keyof T) {
		this.descending = this.key === key ? !this.descending : false;
		this.key = key;
	}

	ariaSort(key: keyof T): 'ascending' | 'descending' | 'none' {
		return this.key === key ? (this.descending ? 'descending' : 'ascending') : 'none';
	}

	apply(rows: readonly T[]): T[] {
		const sign = this.descending ? -1 : 1;
		const key = this.key;
		return [...rows].sort((a, b) => sign * compareValues(a[key], b[key]));
	}
}

export function compareValues(a: unknown, b: unknown): number {
	if (a == null || b == null) return a == null ? (b == null ? 0 : 1) : -1;
	if (a instanceof Date && b instanceof Date) return a.getTime() - b.getTime();
	if (typeof a === 'number' && typeof b === 'number') return a - b;
	return String(a).localeCompare(String(b), 'en', { numeric: true, sensitivity: 'base' });
}
