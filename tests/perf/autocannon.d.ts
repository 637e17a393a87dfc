// The part of autocannon's API the HTTP stage uses (the package ships no types).
declare module 'autocannon' {
	type Histogram = {
		average: number;
		mean: number;
		p50: number;
		p90: number;
		p97_5: number;
		p99: number;
		max: number;
	};
	export type Request = {
		method?: string;
		path?: string;
		headers?: Record<string, string>;
		body?: string;
		setupRequest?: (req: Request, context: Record<string, unknown>) => Request;
		onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
	};
	export type Result = {
		requests: Histogram & { total: number };
		latency: Histogram;
		errors: number;
		timeouts: number;
		non2xx: number;
		'2xx': number;
	};
	export default function autocannon(opts: {
		url: string;
		connections?: number;
		duration?: number;
		headers?: Record<string, string>;
		method?: string;
		body?: string;
		requests?: Request[];
		initialContext?: Record<string, unknown>;
	}): Promise<Result>;
}
