const PREFIXES: readonly (readonly [number, string])[] = [
	[1e9, ' G'],
	[1e6, ' M'],
	[1e3, ' k']
];

/** Three significant figures with an SI prefix: 2.5e6 → "2.5 M", 30000 → "30 k". */
export function formatCompact(value: number): string {
	// Round first so that 999 950 becomes "1 M", not "1000 k".
	const rounded = Number(value.toPrecision(3));
	const prefix = PREFIXES.find(([size]) => Math.abs(rounded) >= size);
	if (!prefix) return String(rounded);
	return `${Number((rounded / prefix[0]).toPrecision(3))}${prefix[1]}`;
}
