const pct = (xs: number[], p: number) =>
	[...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];

/**
 * p50, p95, p99 and max in milliseconds of `n` sequential calls, after a warm-up of a tenth as
 * many (at least three) that are not counted: caches, JIT and the buffer pool settle first.
 */
export async function time(n: number, fn: () => Promise<unknown>) {
	for (let i = 0; i < Math.max(3, Math.ceil(n / 10)); i++) await fn();
	const ms: number[] = [];
	for (let i = 0; i < n; i++) {
		const t0 = performance.now();
		await fn();
		ms.push(performance.now() - t0);
	}
	return { p50: pct(ms, 50), p95: pct(ms, 95), p99: pct(ms, 99), max: Math.max(...ms), runs: n };
}
