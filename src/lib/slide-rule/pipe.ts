import { z } from 'zod';
import * as t from '../tuning';
import { FieldError, fmt, on, row, within, type CalcResult } from './types';

export const pipeSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	exhaustDuration: z.number().positive(),
	rpm: z.number().positive().max(30000),
	gasTemp: z.number().optional()
});
export type PipeInput = z.infer<typeof pipeSchema>;

export function computePipe(i: PipeInput): CalcResult {
	const imp = i.units === 'imperial';
	within('exhaustDuration', i.exhaustDuration, 100, 260, '°');
	let wave = t.JENNINGS_WAVE_SPEED_MS;
	if (i.gasTemp !== undefined) {
		const [lo, hi, u] = imp ? [32, 2000, '°F'] : [0, 1100, '°C'];
		within('gasTemp', i.gasTemp, lo, hi, u);
		wave = t.exhaustWaveSpeedMs(imp ? t.fToC(i.gasTemp) : i.gasTemp);
	}
	const mm = on('rpm', () => t.tunedLengthMm(i.exhaustDuration, i.rpm, wave));
	if (!Number.isFinite(mm)) throw new FieldError('rpm', 'Enter a number.');
	const lenText = (x: number) => (imp ? `${fmt(t.mmToIn(x), 1)} in` : `${fmt(x, 0)} mm`);
	const rows = [
		imp
			? row('waveSpeed', 'Wave speed in the pipe', t.mToFt(wave), 'ft/s', 0)
			: row('waveSpeed', 'Wave speed in the pipe', wave, 'm/s', 0),
		imp
			? row(
					'tunedLength',
					'Tuned length, port to reflector',
					t.mmToIn(mm),
					'in',
					2,
					odd(mm, lenText)
				)
			: row('tunedLength', 'Tuned length, port to reflector', mm, 'mm', 0, odd(mm, lenText)),
		row(
			'openTime',
			'Time the exhaust is open',
			1000 * t.portOpenSeconds(i.exhaustDuration, i.rpm),
			'ms',
			3
		)
	];
	const notes = [
		i.gasTemp === undefined
			? 'Wave speed: Jennings’s 1,700 ft/s (518 m/s). Give the gas temperature to follow it instead: hotter gas, faster wave, longer pipe.'
			: 'Wave speed from the gas temperature, a = √(γ·R·T): hotter gas, faster wave, longer pipe.',
		'The tuned length runs from the piston face at the exhaust port to the middle of the reflecting cone. It sets the rpm the pipe works best at; the cones’ angles set how wide that band is.'
	];
	return { rows, warnings: [], notes };
}

const odd = (mm: number, show: (x: number) => string) =>
	t.plausibilityNote('pipeLengthMm', mm, show);
