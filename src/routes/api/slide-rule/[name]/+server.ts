import { json } from '@sveltejs/kit';
import { apiError } from '$lib/server/guard';
import { isCalculator, runCalculator } from '$lib/slide-rule';
import type { RequestHandler } from './$types';

// Public: the Slide rule is open to everyone, signed in or not, so no guard applies here.
export const POST: RequestHandler = async ({ params, request }) => {
	if (!isCalculator(params.name))
		return apiError(404, `There is no calculator called ${params.name}.`);
	const body = await request.json().catch(() => undefined);
	if (body === undefined) return apiError(400, 'The body is not valid JSON.');
	const outcome = runCalculator(params.name, body);
	if (!outcome.ok) return apiError(422, 'Some inputs are not usable.', outcome.issues);
	return json(outcome.result);
};
