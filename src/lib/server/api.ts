import { isHttpError, json, type RequestEvent } from '@sveltejs/kit';
import { Failure, parse } from '../failure';
import { apiError } from './guard';

export { Failure, parse };

/**
 * Wraps a JSON handler so every failure answers as { error, issues } with its status: a service's
 * `Failure` (400, 409, 413, 415, 422, 429, 503…) and the guard's refusals (401/403/404).
 */
export function api<E extends RequestEvent>(fn: (event: E) => Promise<Response>) {
	return async (event: E): Promise<Response> => {
		try {
			return await fn(event);
		} catch (e) {
			if (e instanceof Failure) return apiError(e.status, e.message, e.issues);
			if (isHttpError(e)) return apiError(e.status, e.body.message, e.body.issues ?? []);
			throw e;
		}
	};
}

export async function readJson(request: Request, maxBytes = 1024 * 1024): Promise<unknown> {
	const type = request.headers.get('content-type') ?? '';
	if (!type.includes('application/json'))
		throw new Failure(415, 'Send the body as application/json.');
	const length = Number(request.headers.get('content-length') ?? 0);
	if (length > maxBytes)
		throw new Failure(413, `The body is over ${Math.round(maxBytes / 1024)} KB.`);
	const text = await request.text();
	if (text.length > maxBytes)
		throw new Failure(413, `The body is over ${Math.round(maxBytes / 1024)} KB.`);
	try {
		return JSON.parse(text);
	} catch {
		throw new Failure(400, 'The body is not valid JSON.');
	}
}

export const created = (body: unknown) => json(body, { status: 201 });
export const noContent = () => new Response(null, { status: 204 });
