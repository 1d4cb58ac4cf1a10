import { airSchema } from '$lib/schemas/calc';
import { calculationEndpoint } from '$lib/server/api';

export const POST = calculationEndpoint(airSchema, (air) => ({ air }));
