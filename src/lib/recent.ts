/**
 * A memo of the most recently used results, at most `max` of them: `keep(key, make)` gives the
 * result kept under `key`, or makes, keeps and gives it (the least recently used goes first).
 * For work whose result depends on its key alone: rendered Markdown, drawn charts, QR codes.
 */
export function recent<V>(max: number): (key: string, make: () => V) => V {
	const kept = new Map<string, V>();
	return (key, make) => {
		if (kept.has(key)) {
			const v = kept.get(key)!;
			kept.delete(key);
			kept.set(key, v);
			return v;
		}
		const v = make();
		if (kept.size >= max) kept.delete(kept.keys().next().value!);
		kept.set(key, v);
		return v;
	};
}
