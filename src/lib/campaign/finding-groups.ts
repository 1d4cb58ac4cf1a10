import type { Finding } from '../calc';
import type { SpeedFigures } from './figures';

/** "15, 20 and 25 m/s", or for a longer sweep "15–55 m/s (9 speeds)". */
export function speedList(speeds_mps: number[]): string {
	const sorted = [...new Set(speeds_mps)].sort((a, b) => a - b).map((v) => +v.toFixed(1));
	if (sorted.length > 3) return `${sorted[0]}–${sorted.at(-1)} m/s (${sorted.length} speeds)`;
	if (sorted.length === 1) return `${sorted[0]} m/s`;
	return `${sorted.slice(0, -1).join(', ')} and ${sorted.at(-1)} m/s`;
}

const SEVERITY = { info: 0, caution: 1, limit: 2 } as const;
const range = (xs: number[], digits: number, unit: string) => {
	const lo = Math.min(...xs).toFixed(digits);
	const hi = Math.max(...xs).toFixed(digits);
	return lo === hi ? `${lo} ${unit}` : `${lo}–${hi} ${unit}`;
};
const tail = (message: string, from: string) => message.slice(message.indexOf(from));

/** One sentence for a kind of finding over several speeds, from the speeds' own figures. */
const SUMMARIES: Record<string, (first: Finding, figures: SpeedFigures[], at: number[]) => string> =
	{
		// The equal-Re speed depends on full scale alone, so the first note states it for all.
		're-gap': (first, figures, at) =>
			`Model Re is ${percentRange(figures.map((f) => f.reRatio))} of full scale at ${speedList(at)}. ${tail(first.message, 'Equal Re needs')}`,
		'equal-re-unreachable': (first, figures, at) =>
			`Model Re is ${percentRange(figures.map((f) => f.reRatio))} of full scale at ${speedList(at)}. ${tail(first.message, 'Equal Re needs')}`,
		're-below-independence': (first, figures, at) =>
			`Model Re (${figures.map((f) => f.modelRe.toPrecision(2)).join(', ')}) is ${tail(first.message, 'below')} at ${speedList(at)}`,
		'speed-above-envelope': (first, _, at) =>
			`${speedList(at)} are ${tail(first.message, 'above')}`,
		'speed-below-envelope': (first, _, at) =>
			`${speedList(at)} are ${tail(first.message, 'below')}`,
		'q-above-envelope': (first, figures, at) =>
			`At ${speedList(at)}, q as set reaches ${range(
				figures.map((f) => f.dynamicPressure_Pa),
				0,
				'Pa'
			)}, ${tail(first.message, 'above')}`,
		'mach-compressible': (first, figures, at) =>
			`At ${speedList(at)} the Mach number is ${range(
				figures.map((f) => f.mach),
				2,
				''
			)}`.trim() + `, ${tail(first.message, 'above')}`
	};
const percentRange = (xs: number[]) => {
	const lo = Math.min(...xs) * 100;
	const hi = Math.max(...xs) * 100;
	const f = (x: number) => +x.toPrecision(2);
	return f(lo) === f(hi) ? `${f(lo)} %` : `${f(lo)}–${f(hi)} %`;
};

/**
 * A sweep's per-speed findings as one finding per kind, naming the speeds it applies to and the
 * range of the figure; the per-speed detail stays in the speed table. Findings about no speed
 * pass through as they are.
 */
export function groupFindings(findings: Finding[], speeds: SpeedFigures[]): Finding[] {
	const out: Finding[] = [];
	const groups = new Map<string, Finding[]>();
	for (const f of findings) {
		if (f.speed_mps === undefined) out.push(f);
		else groups.set(f.code, [...(groups.get(f.code) ?? []), f]);
	}
	const bySpeed = new Map(speeds.map((s) => [s.speed_mps, s]));
	for (const [code, group] of groups) {
		const first = group[0]!;
		const level = group.reduce(
			(l, f) => (SEVERITY[f.level] > SEVERITY[l] ? f.level : l),
			first.level
		);
		const at = group.map((f) => f.speed_mps!);
		if (group.length === 1) {
			out.push({ level, code, message: `${speedList(at)}: ${first.message}` });
			continue;
		}
		const figures = at.map((v) => bySpeed.get(v)).filter((f) => f !== undefined);
		const summary =
			figures.length === at.length ? SUMMARIES[code]?.(first, figures, at) : undefined;
		const message = summary ?? `At ${speedList(at)}: ${first.message}`;
		out.push({ level, code, message });
	}
	return out;
}
