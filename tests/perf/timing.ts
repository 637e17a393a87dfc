const pct = (xs: number[], p: number) =>
	[...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];

/** p50 and p95 in milliseconds of `n` sequential calls. */
export async function time(n: number, fn: () => Promise<unknown>) {
	const ms: number[] = [];
	for (let i = 0; i < n; i++) {
		const t0 = performance.now();
		await fn();
		ms.push(performance.now() - t0);
	}
	return { p50: pct(ms, 50), p95: pct(ms, 95), runs: n };
}
