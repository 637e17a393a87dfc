import { apiError } from '$lib/server/guard';
import type { RequestHandler } from './$types';

// Any other path under /api (an unknown name, an id that is not a number) answers as the API
// does, `{ error, issues }` with 404, rather than with the HTML error page.
export const fallback: RequestHandler = async () => apiError(404, 'Not found.');
