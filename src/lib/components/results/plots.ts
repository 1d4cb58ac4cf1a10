/**
 * What the results plots draw, built from the reduced results: series of points with standard
 * uncertainties, trend lines and marks, styled so that a configuration keeps its colour and
 * marker and a speed its dash in every plot, and lines stay apart in grey print.
 */
import {
	symbolCircle,
	symbolCross,
	symbolDiamond,
	symbolSquare,
	symbolTriangle,
	type SymbolType
} from 'd3-shape';
import type {
	CampaignResults,
	DistanceTrend,
	PlaneRunResult,
	ReynoldsSweepResult
} from '$lib/results/types';
import { graded, SERIES_COLOURS } from './colour';
import { metres, speedText, trimmed, yawText } from './figures';

export type PlotPoint = {
	x: number;
	y: number;
	/** Standard uncertainty of y. */ u: number | null;
};

export type PlotSeries = {
	key: string;
	label: string;
	colour: string;
	dash?: string;
	marker: SymbolType;
	points: PlotPoint[];
};

/** A line without markers, such as a least-squares fit. */
export type PlotLine = {
	key: string;
	label: string;
	colour: string;
	dash?: string;
	points: [number, number][];
};

/** A vertical mark across the plot at one x, such as where Re-independence begins. */
export type PlotRule = { key: string; x: number; label: string; colour: string };

/** Marker area in square SVG user units, as d3-shape's symbols take it. */
export const MARKER_AREA = 42;

const MARKERS = [symbolCircle, symbolSquare, symbolTriangle, symbolDiamond, symbolCross];
const DASHES = [undefined, '6 3', '2 3', '8 3 2 3'];

export type SeriesStyles = {
	colour: (configurationId: string) => string;
	marker: (configurationId: string) => SymbolType;
	dash: (speed_mps: number) => string | undefined;
	/** Where speed is the x axis, as in a Reynolds sweep, the dash tells planes apart instead. */
	planeDash: (planeId: string) => string | undefined;
};

/** Styles fixed over the whole campaign, so hiding one configuration never recolours another. */
export function seriesStyles(results: CampaignResults): SeriesStyles {
	const configurations = [...new Set(results.runs.map((r) => r.configurationId))];
	const speeds = [...new Set(results.runs.map((r) => r.speed_mps))].sort((a, b) => a - b);
	const planes = [
		...new Set(
			[...results.runs].sort((a, b) => a.downstream_m - b.downstream_m).map((r) => r.planeId)
		)
	];
	const at = <T>(list: readonly T[], k: number) => list[Math.max(0, k) % list.length]!;
	return {
		colour: (id) => at(SERIES_COLOURS, configurations.indexOf(id)),
		marker: (id) => at(MARKERS, configurations.indexOf(id)),
		dash: (speed) => at(DASHES, speeds.indexOf(speed)),
		planeDash: (planeId) => at(DASHES, planes.indexOf(planeId))
	};
}

const trendLabel = (t: DistanceTrend) => `${t.configurationLabel} · ${speedText(t.speed_mps)}`;
const trendKey = (t: DistanceTrend) => `${t.configurationId}|${t.yaw_deg}|${t.speed_mps}`;

/** Plane averages, or differences from the baseline, against downstream distance. */
export function trendSeries(
	trends: DistanceTrend[],
	styles: SeriesStyles,
	quantity: 'average' | 'difference'
): PlotSeries[] {
	return trends
		.map((t) => ({
			key: trendKey(t),
			label: trendLabel(t),
			colour: styles.colour(t.configurationId),
			dash: styles.dash(t.speed_mps),
			marker: styles.marker(t.configurationId),
			points: t.points.flatMap((p): PlotPoint[] => {
				if (quantity === 'average')
					return [{ x: p.downstream_m, y: p.averageCp, u: p.uncertainty }];
				return p.difference === null
					? []
					: [{ x: p.downstream_m, y: p.difference, u: p.differenceUncertainty }];
			})
		}))
		.filter((s) => s.points.length > 0);
}

/** The least-squares line of each trend that has one, across the planes it was fitted to. */
export function fitLines(trends: DistanceTrend[], styles: SeriesStyles): PlotLine[] {
	return trends.flatMap((t) => {
		if (!t.fit || t.points.length === 0) return [];
		const xs = t.points.map((p) => p.downstream_m);
		const ends = [Math.min(...xs), Math.max(...xs)];
		return [
			{
				key: `fit|${trendKey(t)}`,
				label: `Fit, ${trendLabel(t)}`,
				colour: styles.colour(t.configurationId),
				dash: '1 3',
				points: ends.map((x): [number, number] => [x, t.fit!.intercept + t.fit!.slope * x])
			}
		];
	});
}

/** A run's row averages with their heights, or column averages with their lateral positions. */
function averagesAlong(r: PlaneRunResult, along: 'rows' | 'columns') {
	return along === 'rows'
		? { positions: r.y_m, averages: r.rowAverageCp, u: r.uncertainty.rowAverageCp }
		: { positions: r.z_m, averages: r.columnAverageCp, u: r.uncertainty.columnAverageCp };
}

const runLabel = (r: PlaneRunResult) =>
	`${r.configurationLabel} · ${speedText(r.speed_mps)} · repeat ${r.repeat}`;

/** Row averages against y, or column averages against z, one line per run on a single plane. */
export function profileSeries(
	runs: PlaneRunResult[],
	styles: SeriesStyles,
	along: 'rows' | 'columns'
): PlotSeries[] {
	return runs.map((r) => {
		const { positions, averages, u } = averagesAlong(r, along);
		return {
			key: `${r.run}`,
			label: runLabel(r),
			colour: styles.colour(r.configurationId),
			dash: styles.dash(r.speed_mps),
			marker: styles.marker(r.configurationId),
			points: positions
				.flatMap((x, k): PlotPoint[] => {
					const y = averages[k];
					return y === null || y === undefined ? [] : [{ x, y, u: u[k] ?? null }];
				})
				.sort((a, b) => a.x - b.x)
		};
	});
}

// Probe rows on different planes count as the same row when within half a millimetre.
const positionKey = (value_m: number) => Math.round(value_m * 2000);

/**
 * Row (or column) averages of one configuration's runs against downstream distance: one line per
 * probe height (or lateral position) shared by the planes, shaded from lowest to highest.
 */
export function distanceProfileSeries(
	runs: PlaneRunResult[],
	along: 'rows' | 'columns'
): PlotSeries[] {
	const lines = new Map<number, { position: number; points: PlotPoint[] }>();
	for (const r of runs) {
		const { positions, averages, u } = averagesAlong(r, along);
		positions.forEach((position, k) => {
			const y = averages[k];
			if (y === null || y === undefined) return;
			const key = positionKey(position);
			const line = lines.get(key) ?? { position, points: [] };
			line.points.push({ x: r.downstream_m, y, u: u[k] ?? null });
			lines.set(key, line);
		});
	}
	const sorted = [...lines.values()].sort((a, b) => a.position - b.position);
	const name = along === 'rows' ? 'y' : 'z';
	return sorted.map((line, k) => ({
		key: `${name}${positionKey(line.position)}`,
		label: `${name} ${metres(line.position)}`,
		colour: graded(sorted.length > 1 ? k / (sorted.length - 1) : 0),
		marker: symbolCircle,
		points: line.points.sort((a, b) => a.x - b.x)
	}));
}

/** Lines shaded in order, named in a legend by their first and last. */
export type Shading = { from: string; to: string; what: string };

export function shadingOf(series: PlotSeries[], noun: string): Shading | undefined {
	const first = series[0];
	const last = series.at(-1);
	if (!first || !last) return undefined;
	return {
		from: graded(0),
		to: graded(1),
		what: `one line per ${noun}, ${first.label} to ${last.label}`
	};
}

/** Wake drag against achieved Re, one line per configuration, yaw and plane. */
export function sweepSeries(
	sweeps: ReynoldsSweepResult[],
	styles: SeriesStyles,
	planeLabels: Map<string, string>
): PlotSeries[] {
	return sweeps.map((s) => ({
		key: sweepKey(s),
		label: sweepLabel(s, planeLabels),
		colour: styles.colour(s.configurationId),
		dash: styles.planeDash(s.planeId),
		marker: styles.marker(s.configurationId),
		points: s.points.map((p) => ({ x: p.re, y: p.value, u: p.uncertainty }))
	}));
}

export const sweepKey = (s: ReynoldsSweepResult) =>
	`${s.configurationId}|${s.yaw_deg}|${s.planeId}`;

export const sweepLabel = (s: ReynoldsSweepResult, planeLabels: Map<string, string>) =>
	`${s.configurationLabel} · ${yawText(s.yaw_deg)} · ${planeLabels.get(s.planeId) ?? s.planeId}`;

/** A tolerance as a percentage without needless decimals: 0.02 → "2 %". */
export const tolerancePercent = (tolerance: number) => `${trimmed(tolerance * 100, 2)} %`;
