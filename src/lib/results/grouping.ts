/** Items gathered by a key, each group non-empty, groups in the order their first item comes. */
export function groupBy<T>(items: readonly T[], key: (item: T) => string): [T, ...T[]][] {
	const groups = new Map<string, [T, ...T[]]>();
	for (const item of items) {
		const k = key(item);
		const group = groups.get(k);
		if (group) group.push(item);
		else groups.set(k, [item]);
	}
	return [...groups.values()];
}
