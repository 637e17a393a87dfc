import { describe, expect, it } from 'vitest';
import * as t from '../../../src/lib/tuning';

describe('tyre sizes (ETRTO / ISO 5751 convention: D = 25.4·rim + 2·W·AR/100)', () => {
	it('reads metric and inch sizes, with load index and speed symbol', () => {
		expect(t.parseTyre('130/60-13 53P')).toEqual({
			widthMm: 130,
			aspectPct: 60,
			rimIn: 13,
			construction: 'diagonal',
			loadIndex: 53,
			speedSymbol: 'P'
		});
		expect(t.parseTyre('120/70R12')).toEqual({
			widthMm: 120,
			aspectPct: 70,
			rimIn: 12,
			construction: 'radial'
		});
		const inch = t.parseTyre('3.50-10');
		expect(inch).toMatchObject({ aspectPct: 100, rimIn: 10, approximate: true });
		expect(inch.widthMm).toBeCloseTo(3.5 * 25.4, 12);
		expect(t.parseTyre('3.00-10 42J').speedSymbol).toBe('J');
	});
	it('a tyre maker’s sidewall guide works 120/90-18 to 673.2 mm', () => {
		// 25.4 × 18 = 457.2; 2 × 120 × 0.90 = 216; 457.2 + 216 = 673.2 mm.
		expect(t.tyreDiameterMm('120/90-18')).toBeCloseTo(673.2, 9);
	});
	it('circumference is π · D · factor', () => {
		expect(t.tyreCircumferenceMm('120/70-12')).toBeCloseTo(Math.PI * 472.8, 9);
		expect(t.tyreCircumferenceMm('120/70-12', 0.97)).toBeCloseTo(Math.PI * 472.8 * 0.97, 9);
	});
	it('refuses what it cannot read, naming designation', () => {
		expect(() => t.parseTyre('big knobbly one')).toThrow(/^designation/);
		expect(() => t.parseTyre('130/60-13 53X')).toThrow(/^designation/);
		expect(() => t.tyreCircumferenceMm('120/70-12', 2)).toThrow(/^rollingFactor/);
		expect(() => t.tyreCircumferenceMm('120/70-12', NaN)).toThrow(/^rollingFactor/);
	});
});

describe('speed symbols (ISO 4000-1 / ETRTO table)', () => {
	// ISO 4000-1 / ETRTO Standards Manual speed-symbol table.
	const table: [string, number][] = [
		['B', 50],
		['C', 60],
		['D', 65],
		['E', 70],
		['F', 80],
		['G', 90],
		['J', 100],
		['K', 110],
		['L', 120],
		['M', 130],
		['N', 140],
		['P', 150],
		['Q', 160],
		['R', 170],
		['S', 180],
		['T', 190],
		['U', 200],
		['H', 210],
		['V', 240],
		['W', 270],
		['Y', 300]
	];
	it.each(table)('%s is %i km/h', (letter, kmh) => {
		expect(t.speedSymbolKmh(letter)).toBe(kmh);
		expect(t.speedSymbolKmh(letter.toLowerCase())).toBe(kmh);
	});
	it('refuses unknown letters', () => {
		expect(() => t.speedSymbolKmh('A')).toThrow(/^letter/);
		expect(() => t.speedSymbolKmh('')).toThrow(/^letter/);
	});
});
