import { matrixRequestSchema } from '$lib/schemas/calc';
import { calculationEndpoint } from '$lib/server/api';
import { evaluateMatrixRequest } from '$lib/server/calculations';

export const POST = calculationEndpoint(matrixRequestSchema, evaluateMatrixRequest);
