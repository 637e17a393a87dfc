// Two-stroke premix: oil by volume to fuel, R:1.
import { between, nonNegative, positive } from './check';

/** Oil for a quantity of fuel at R:1, ml: 1000·L/R (50:1 is 20 ml a litre). */
export function premixOilMl(fuelLitres: number, ratio: number): number {
	positive('fuelLitres', fuelLitres);
	between('ratio', ratio, 10, 200);
	return (1000 * fuelLitres) / ratio;
}

export type TopUp = {
	tankLitres: number;
	currentRatio: number;
	addLitres: number;
	targetRatio: number;
};

/**
 * Topping up a tank that holds `tankLitres` of mix at currentRatio:1 with `addLitres` of fresh
 * fuel, towards targetRatio:1. What is in the tank splits by volume, fuel R/(R + 1) and oil
 * 1/(R + 1); the oil to add is what the new fuel total needs at the target less what is there.
 * When the tank already holds more oil than the target allows, `moreFuelLitres` says how much
 * more fuel would bring it there (and `oilMl` is 0).
 */
export function premixBalance(input: TopUp): { oilMl: number; moreFuelLitres: number } {
	if (!input || typeof input !== 'object') throw new RangeError('input must be an object');
	const tank = nonNegative('tankLitres', input.tankLitres);
	const r0 = between('currentRatio', input.currentRatio, 10, 200);
	const add = nonNegative('addLitres', input.addLitres);
	const rt = between('targetRatio', input.targetRatio, 10, 200);
	const fuel = (tank * r0) / (r0 + 1) + add;
	const oil = tank / (r0 + 1);
	const oilMl = 1000 * (fuel / rt - oil);
	return oilMl < -1e-9
		? { oilMl: 0, moreFuelLitres: oil * rt - fuel }
		: { oilMl: Math.max(0, oilMl), moreFuelLitres: 0 };
}

/** The oil to add for a top-up; a target that needs fuel, not oil, is refused (see premixBalance). */
export function premixTopUp(input: TopUp): { oilMl: number } {
	const b = premixBalance(input);
	if (b.moreFuelLitres > 0)
		throw new RangeError(
			`targetRatio ${input.targetRatio}:1 needs less oil than the tank already holds: add at least ${b.moreFuelLitres.toFixed(2)} more litres of fuel`
		);
	return { oilMl: b.oilMl };
}
