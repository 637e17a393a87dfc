import { isHttpError, isRedirect, json, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { ApiFailure } from '../failure';
import { apiError } from './guard';
import { PhotoError } from './sheet/photos';

export { ApiFailure };

/**
 * Wraps a JSON handler so every failure answers as { error, issues } with its status: guard and
 * access errors (401/403/404), bad bodies (400/415/422), conflicts (409), sizes (413).
 */
export function api<E extends RequestEvent>(fn: (event: E) => Promise<Response>) {
	return async (event: E): Promise<Response> => {
		try {
			return await fn(event);
		} catch (e) {
			if (e instanceof ApiFailure) return apiError(e.status, e.message, e.issues);
			if (e instanceof PhotoError) return apiError(e.status, e.message);
			if (isHttpError(e)) return apiError(e.status, e.body.message, e.body.issues ?? []);
			if (isRedirect(e)) throw e;
			throw e;
		}
	};
}

export async function readJson(request: Request, maxBytes = 1024 * 1024): Promise<unknown> {
	const type = request.headers.get('content-type') ?? '';
	if (!type.includes('application/json'))
		throw new ApiFailure(415, 'Send the body as application/json.');
	const length = Number(request.headers.get('content-length') ?? 0);
	if (length > maxBytes)
		throw new ApiFailure(413, `The body is over ${Math.round(maxBytes / 1024)} KB.`);
	const text = await request.text();
	if (text.length > maxBytes)
		throw new ApiFailure(413, `The body is over ${Math.round(maxBytes / 1024)} KB.`);
	try {
		return JSON.parse(text);
	} catch {
		throw new ApiFailure(400, 'The body is not valid JSON.');
	}
}

export function parse<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
	const r = schema.safeParse(body);
	if (!r.success) {
		throw new ApiFailure(
			422,
			'The body does not fit the schema.',
			r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
		);
	}
	return r.data;
}

export const created = (body: unknown) => json(body, { status: 201 });
export const noContent = () => new Response(null, { status: 204 });
