import { similarity } from '$lib/calc';
import { similarityRequestSchema } from '$lib/schemas/calc';
import { calculationEndpoint } from '$lib/server/api';

export const POST = calculationEndpoint(
	similarityRequestSchema,
	({ fullScaleLength, fullScaleSpeed, modelSpeed, ...rest }) =>
		similarity({
			fullScaleLength_m: fullScaleLength,
			fullScaleSpeed_mps: fullScaleSpeed,
			modelSpeed_mps: modelSpeed,
			...rest
		})
);
