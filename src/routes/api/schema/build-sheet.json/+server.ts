import { json } from '@sveltejs/kit';
import { exportJsonSchema } from '$lib/sheet/export-schema';
import type { RequestHandler } from './$types';

// Public and static: the JSON Schema of the export format, generated from its zod schema.
export const GET: RequestHandler = async () =>
	json(exportJsonSchema(), {
		headers: { 'content-type': 'application/schema+json', 'cache-control': 'public, max-age=3600' }
	});
