import { blockageRequestSchema } from '$lib/schemas/calc';
import { calculationEndpoint } from '$lib/server/api';
import { blockageFromRequest } from '$lib/server/calculations';

export const POST = calculationEndpoint(blockageRequestSchema, blockageFromRequest);
