import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { PIPE_STYLE } from '../../../src/lib/stats/pipes';

// WCAG 2.2, "relative luminance" and "contrast ratio" (Understanding 1.4.3 / 1.4.11 definitions):
// L = 0.2126 R + 0.7152 G + 0.0722 B of the linearised sRGB channels; ratio (L1 + 0.05) / (L2 + 0.05).
function luminance(hex: string) {
	const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
	const lin = (c: number) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
	return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}
const ratio = (a: string, b: string) => {
	const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
	return (hi + 0.05) / (lo + 0.05);
};

/** The paper colour of each theme, as app.css sets it. */
function papers(): string[] {
	const css = readFileSync('src/app.css', 'utf8');
	return [...css.matchAll(/--sl-paper:\s*(#[0-9a-f]{6})/g)].map((m) => m[1]);
}

describe('the speed map’s marks against both papers', () => {
	it('checks the formula on its known ends (WCAG: black on white is 21:1)', () => {
		expect(ratio('#000000', '#ffffff')).toBeCloseTo(21, 5);
		expect(ratio('#777777', '#ffffff')).toBeCloseTo(4.48, 2); // WebAIM's checker gives 4.48:1 (from memory)
	});

	it('keeps every pipe colour at 3:1 or more on the light and the dark paper (WCAG 1.4.11)', () => {
		const grounds = papers();
		expect(new Set(grounds).size).toBe(2);
		for (const { colour } of Object.values(PIPE_STYLE))
			for (const g of grounds)
				expect(ratio(colour, g), `${colour} on ${g}`).toBeGreaterThanOrEqual(3);
	});
});
