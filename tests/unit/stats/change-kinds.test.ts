import { describe, expect, it } from 'vitest';
import { changeKind, CHANGE_KINDS, judgeStep } from '../../../src/lib/sheet/change-kinds';
import { SETUP_FIELDS } from '../../../src/lib/sheet/setup-fields';
import { buildWords, words } from '../../../src/lib/search/words';

// The rules are the project's own (stated on the change-effects page); these pin them down.
const base = {
	primaryDriver: 15,
	mainJet: 92,
	needleClip: 2,
	rearTyre: '120/70-12',
	peakRpm: 9000
};
const gps = (kmh: number, density = 1.2) => ({ kmh, method: 'gps-logger', density });

describe('change kinds', () => {
	it('every setup field belongs to one kind, is ignored, or counts as "other"', () => {
		const kinded = CHANGE_KINDS.flatMap((k) => k.fields as readonly string[]);
		expect(new Set(kinded).size).toBe(kinded.length); // no field in two kinds
		for (const f of kinded) expect(SETUP_FIELDS.map((s) => s.name)).toContain(f);
	});

	it('names the one kind that changed, else mixed or none', () => {
		expect(changeKind(base, { ...base, primaryDriver: 16 })).toBe('final-drive');
		expect(changeKind(base, { ...base, mainJet: 94, needleClip: 3 })).toBe('mixed');
		expect(changeKind(base, { ...base, octane: 98 })).toBe('mixed');
		expect(changeKind(base, { ...base, peakRpm: 9500 })).toBe('none');
		expect(changeKind({ ...base, needle: '' }, { ...base, needle: null })).toBe('none');
	});

	it('counts a pair only with the same method and air within 5 %', () => {
		expect(judgeStep('tyre', gps(90), gps(92))).toEqual({
			counts: true,
			kind: 'tyre',
			deltaKmh: 2
		});
		expect(judgeStep('tyre', gps(90), { ...gps(92), method: 'radar' }).counts).toBe(false);
		expect(judgeStep('tyre', gps(90, 1.2), gps(92, 1.2 * 1.05)).counts).toBe(true); // exactly 5 %
		expect(judgeStep('tyre', gps(90, 1.2), gps(92, 1.2 * 1.051)).counts).toBe(false);
		expect(judgeStep('tyre', null, gps(92)).counts).toBe(false);
	});
});

describe('search words', () => {
	it('keeps words of three letters or more, drops stopwords and operators, once each', () => {
		expect(words('The 70 cc Halvard chamber, with 19 mm carb')).toEqual([
			'halvard',
			'chamber',
			'carb'
		]);
		expect(words('a 70 cc')).toEqual([]);
		// Operators typed by a reader are not passed through.
		expect(words('-stock +"pipe"')).toEqual(['stock', 'pipe']);
		expect(buildWords('Pipe on', 'The pipe, again', 'Pipe')).toEqual(['pipe', 'again']);
	});
});
