/**
 * Requests known to be the most expensive a client can ask for, each sent as given: the fuzz
 * may not draw them, and each must still be refused or answered within the time budget.
 */
import type { Actor } from './fuzz-app';
import { devalueText, Raw } from './fuzz-arbitraries';
import type { Body } from './fuzz-bodies';
import type { FuzzRequest } from './fuzz-requests';
import type { Target } from './fuzz-routes';
import type { Fixture } from './fuzz-fixture';

export type WorstCase = {
	name: string;
	target: Target;
	request: FuzzRequest;
	/**
	 * Wall time allowed when sending the body itself takes time: the server reads and drops an
	 * oversized upload without holding the event loop, but 25 MiB cross loopback in ~100 ms
	 * (common practice, no source).
	 */
	budget_ms?: number;
};

const MIB = 1024 * 1024;

/** Distinct numbers, rounded so that a long list still fits under the 1 MiB body limit. */
function distinct(count: number, from: number, to: number): Raw {
	const values = Array.from({ length: count }, (_, i) =>
		Number((from + (i * (to - from)) / count).toFixed(4))
	);
	return new Raw(`${count} distinct numbers`, `[${values.join(',')}]`, values.join(','), values);
}

export function worstCases(fx: Fixture): WorstCase[] {
	const isa = { model: 'isa', geopotentialAltitude: 0 };
	const matrix = (grid: unknown, more: Record<string, unknown> = {}) => ({
		configurations: [{ id: 'base', baseline: true }],
		speeds: [20],
		yawAngles_deg: [0],
		planes: [{ id: 'x1', downstream: 0.5, grid }],
		dwellPerPoint: 10,
		modelReferenceLength: 0.5,
		tunnelAir: isa,
		...more
	});
	const grid = (rows: number, columns: number) => ({
		rows,
		columns,
		rowSpacing: 0.001,
		columnSpacing: 0.001
	});
	const request = (actor: Actor, body: Body, query: [string, string][] = []): FuzzRequest => ({
		actor,
		params: { id: fx.draftCampaign },
		query,
		body,
		contentType: 'own',
		accept: 'application/json'
	});
	const json = (value: unknown): Body => ({ encoding: 'json', value });
	const calcMatrix: Target = { kind: 'endpoint', routeId: '/api/v1/calc/matrix', method: 'POST' };
	const putCampaign: Target = {
		kind: 'endpoint',
		routeId: '/api/v1/campaigns/[id]',
		method: 'PUT'
	};
	const matrixPage: Target = {
		kind: 'endpoint',
		routeId: '/api/v1/campaigns/[id]/matrix',
		method: 'GET'
	};
	const onInReview = (r: FuzzRequest): FuzzRequest => ({
		...r,
		params: { id: fx.inReviewCampaign }
	});
	return [
		{
			name: 'matrix grid of 3e7 rows',
			target: calcMatrix,
			request: request('aero', json(matrix(grid(3e7, 1))))
		},
		{
			name: 'matrix grid of 2^32 rows',
			target: calcMatrix,
			request: request('aero', json(matrix(grid(2 ** 32, 1))))
		},
		{
			name: 'matrix grid of 1e4 × 1e4',
			target: calcMatrix,
			request: request('aero', json(matrix(grid(1e4, 1e4))))
		},
		{
			name: 'matrix with repeats = 1e9',
			target: calcMatrix,
			request: request('aero', json(matrix(grid(2, 2), { repeats: 1e9 })))
		},
		{
			name: 'matrix with 10 000 speeds and 80 000 yaw angles',
			target: calcMatrix,
			request: request(
				'aero',
				json(
					matrix(grid(2, 2), {
						speeds: distinct(10_000, 1, 100),
						yawAngles_deg: distinct(80_000, -180, 180)
					})
				)
			)
		},
		{
			name: 'matrix at the 250 000-point cap, last page of 5000',
			target: calcMatrix,
			request: request(
				'aero',
				json(matrix(grid(100, 100), { speeds: distinct(25, 10, 35), offset: 245_000, limit: 5000 }))
			)
		},
		{
			name: 'matrix body nested 10 000 deep',
			target: calcMatrix,
			request: request(
				'aero',
				json(new Raw('depth 10000', '['.repeat(10_000) + ']'.repeat(10_000)))
			)
		},
		{
			name: 'matrix body just over 1 MiB',
			target: calcMatrix,
			request: request(
				'aero',
				json({ configurations: new Raw('1 MiB', JSON.stringify('x'.repeat(MIB))) })
			)
		},
		{
			name: 'campaign with 80 000 distinct yaw angles',
			target: putCampaign,
			request: request(
				'aero',
				json({ ...fx.campaignBody, yawAngles_deg: distinct(80_000, -180, 180) })
			)
		},
		{
			name: 'campaign with 80 000 distinct speeds',
			target: putCampaign,
			request: request('aero', json({ ...fx.campaignBody, speeds_mps: distinct(80_000, 1, 50) }))
		},
		{
			name: 'campaign form with 50 000 distinct yaw angles',
			target: { kind: 'action', routeId: '/(app)/campaigns/[id]/edit', action: 'default' },
			request: request('aero', {
				encoding: 'urlencoded',
				fields: [
					[
						'__superform_json',
						new Raw(
							'devalue of the campaign',
							devalueText({ ...fx.campaignBody, yawAngles_deg: distinct(50_000, -180, 180) })
						)
					]
				]
			})
		},
		{
			name: 'largest matrix page of the 54 000-point campaign',
			target: matrixPage,
			request: onInReview(request('aero', { encoding: 'none' }, [['limit', '5000']]))
		},
		{
			name: 'last matrix page of the 54 000-point campaign',
			target: matrixPage,
			request: onInReview(
				request('aero', { encoding: 'none' }, [
					['offset', '53999'],
					['limit', '5000']
				])
			)
		},
		{
			name: 'readings file over 24 MiB',
			target: { kind: 'endpoint', routeId: '/api/v1/campaigns/[id]/readings', method: 'POST' },
			request: {
				...request('operator', { encoding: 'text', text: new Raw('25 MiB', 'x'.repeat(25 * MIB)) }),
				params: { id: fx.approvedCampaign },
				contentType: 'text/csv'
			},
			budget_ms: 500
		}
	];
}
