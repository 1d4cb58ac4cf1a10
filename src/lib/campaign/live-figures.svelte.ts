import type { Blockage, Similarity } from '../calc';
import type { CampaignDefinition } from '../schemas/campaign';
import type { MatrixEvaluation } from '../server/calculations';
import type { PlanFacility, PlanModel } from './plan';
import { blockageRequest, matrixSummaryRequest, similarityRequest } from './requests';

type ApiError = { error: { message: string; fields?: Record<string, string[]> } };

async function post<T>(path: string, body: unknown, signal: AbortSignal): Promise<T> {
	const response = await fetch(path, {
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify(body),
		signal
	});
	const data = await response.json();
	if (!response.ok) {
		const { error } = data as ApiError;
		const detail = error.fields ? Object.values(error.fields).flat()[0] : undefined;
		throw new Error(detail ?? error.message);
	}
	return data as T;
}

/**
 * The editor's live figures: recomputed by the calculation API a moment after the user stops
 * typing; a newer edit cancels the request still on its way.
 */
export class LiveFigures {
	similarity = $state<(Similarity & { speed_mps: number })[]>([]);
	blockage = $state<Blockage | null>(null);
	matrix = $state<MatrixEvaluation | null>(null);
	problem = $state<string | null>(null);
	pending = $state(false);

	#timer: ReturnType<typeof setTimeout> | undefined;
	#inFlight: AbortController | undefined;

	constructor(private readonly delay_ms = 300) {}

	request(
		def: CampaignDefinition,
		model: PlanModel | undefined,
		facility: PlanFacility | undefined
	) {
		clearTimeout(this.#timer);
		if (!model || !facility) return;
		this.pending = true;
		this.#timer = setTimeout(() => void this.#run(def, model, facility), this.delay_ms);
	}

	async #run(def: CampaignDefinition, model: PlanModel, facility: PlanFacility) {
		this.#inFlight?.abort();
		const controller = new AbortController();
		this.#inFlight = controller;
		const { signal } = controller;
		try {
			const [similarity, blockage, matrix] = await Promise.all([
				Promise.all(
					def.speeds_mps.map(async (speed_mps) => ({
						speed_mps,
						...(await post<Similarity>(
							'/api/v1/calc/similarity',
							similarityRequest(def, model, speed_mps),
							signal
						))
					}))
				),
				post<Blockage>('/api/v1/calc/blockage', blockageRequest(def, model, facility), signal),
				post<MatrixEvaluation>(
					'/api/v1/calc/matrix',
					matrixSummaryRequest(def, model, facility),
					signal
				)
			]);
			this.similarity = similarity;
			this.blockage = blockage;
			this.matrix = matrix;
			this.problem = null;
		} catch (error) {
			if (signal.aborted) return;
			this.problem = error instanceof Error ? error.message : String(error);
		} finally {
			if (this.#inFlight === controller) this.pending = false;
		}
	}

	dispose() {
		clearTimeout(this.#timer);
		this.#inFlight?.abort();
	}
}
