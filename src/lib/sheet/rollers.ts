// Roller weights as people write them: "3x5.0 + 3x4.5", "3 × 5 g + 3 × 4.5 g" or "5, 5, 5, 4.5, 4.5, 4.5".

export type Rollers = { grams: number[]; problem: string | null };

export function parseRollers(text: string): Rollers {
	const s = text.trim().replace(/g\b/gi, '');
	if (!s) return { grams: [], problem: null };
	const grams: number[] = [];
	const parts = /[x×*]/.test(s) ? s.split('+') : s.split(/[\s;,]+/);
	for (const raw of parts) {
		const p = raw.trim();
		if (!p) continue;
		const m = /^(\d+)\s*[x×*]\s*(\d+(?:\.\d+)?)$/.exec(p) ?? /^()(\d+(?:\.\d+)?)$/.exec(p);
		if (!m) return { grams, problem: `“${p}” is not a weight or a count × weight.` };
		const count = m[1] ? Number(m[1]) : 1;
		const g = Number(m[2]);
		if (g < 1 || g > 30) return { grams, problem: `${g} g is outside 1–30 g for one roller.` };
		for (let i = 0; i < count; i++) grams.push(g);
	}
	if (grams.length < 2 || grams.length > 12)
		return { grams, problem: `${grams.length} rollers: a variator has 2 to 12 slots.` };
	return { grams, problem: null };
}

export const rollerTotal = (text: string | null | undefined) => {
	const r = parseRollers(text ?? '');
	return r.problem || r.grams.length === 0 ? null : r.grams.reduce((a, b) => a + b, 0);
};
