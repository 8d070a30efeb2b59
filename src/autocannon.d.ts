// autocannon (the load generator of `npm run cluster:fault`) ships no types; the part used here.
declare module 'autocannon' {
	interface Histogram {
		p50: number;
		p99: number;
		average: number;
	}
	interface Request {
		method?: string;
		path?: string;
		headers?: Record<string, string>;
		body?: string;
		setupRequest?: (req: Request, context: Record<string, unknown>) => Request;
		onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string | string[]>) => void;
	}
	interface Options {
		url: string;
		connections?: number;
		duration?: number;
		timeout?: number;
		headers?: Record<string, string>;
		requests?: Request[];
	}
	interface Result {
		latency: Histogram;
		errors: number;
		timeouts: number;
		non2xx: number;
	}
	export default function autocannon(options: Options): Promise<Result>;
}
