import type { Finding } from '../calc';
import type { RevisionSnapshot } from './types';

export type AxisChange<T> = { added: T[]; removed: T[]; changed: T[] };

export type RevisionDiff = {
	configurations: AxisChange<string>;
	speeds_mps: AxisChange<number>;
	yawAngles_deg: AxisChange<number>;
	planes: AxisChange<string>;
	assumptions: { what: string; before: string; after: string }[];
	findings: { appeared: Finding[]; resolved: Finding[] };
	points: { before: number; after: number };
};

function byKey<T, K extends string | number>(
	before: T[],
	after: T[],
	key: (x: T) => K,
	same: (a: T, b: T) => boolean
): AxisChange<K> {
	const old = new Map(before.map((x) => [key(x), x] as const));
	const now = new Map(after.map((x) => [key(x), x] as const));
	return {
		added: [...now.keys()].filter((k) => !old.has(k)),
		removed: [...old.keys()].filter((k) => !now.has(k)),
		changed: [...now.keys()].filter((k) => old.has(k) && !same(old.get(k)!, now.get(k)!))
	};
}

const json = (x: unknown) => JSON.stringify(x);
const findingKey = (f: Finding) => `${f.level}|${f.code}|${f.message}`;

/** What changed from one submitted revision to the next, as a reviewer reads it. */
export function diffRevisions(previous: RevisionSnapshot, next: RevisionSnapshot): RevisionDiff {
	const a = previous.definition;
	const b = next.definition;
	const assumptions: RevisionDiff['assumptions'] = [];
	const compare = (
		what: string,
		before: unknown,
		after: unknown,
		show = (x: unknown) => json(x)
	) => {
		if (json(before) !== json(after))
			assumptions.push({ what, before: show(before), after: show(after) });
	};
	compare('Scale model', previous.model.name, next.model.name, String);
	compare('Facility', previous.facility.name, next.facility.name, String);
	compare('Air assumption', a.air, b.air);
	compare('Full-scale speed (m/s)', a.fullScaleSpeed_mps, b.fullScaleSpeed_mps, String);
	compare('Full-scale altitude (m)', a.fullScaleAltitude_m, b.fullScaleAltitude_m, String);
	compare(
		'Re-independence threshold',
		a.reIndependenceThreshold,
		b.reIndependenceThreshold,
		String
	);
	compare('Dwell per point (s)', a.dwellPerPoint_s, b.dwellPerPoint_s, String);
	compare('Repeats', a.repeats, b.repeats, String);

	const oldFindings = new Set(previous.figures.findings.map(findingKey));
	const newFindings = new Set(next.figures.findings.map(findingKey));
	const same = (x: number, y: number) => x === y;
	return {
		configurations: byKey(
			a.configurations,
			b.configurations,
			(c) => c.id,
			(x, y) => json(x) === json(y)
		),
		speeds_mps: byKey(a.speeds_mps, b.speeds_mps, (v) => v, same),
		yawAngles_deg: byKey(a.yawAngles_deg, b.yawAngles_deg, (v) => v, same),
		planes: byKey(
			a.planes,
			b.planes,
			(p) => p.id,
			(x, y) => json(x) === json(y)
		),
		assumptions,
		findings: {
			appeared: next.figures.findings.filter((f) => !oldFindings.has(findingKey(f))),
			resolved: previous.figures.findings.filter((f) => !newFindings.has(findingKey(f)))
		},
		points: {
			before: previous.figures.occupancy.counts.points,
			after: next.figures.occupancy.counts.points
		}
	};
}

export function isUnchanged(d: RevisionDiff): boolean {
	const axes = [d.configurations, d.speeds_mps, d.yawAngles_deg, d.planes];
	return (
		axes.every((x) => !x.added.length && !x.removed.length && !x.changed.length) &&
		!d.assumptions.length
	);
}
