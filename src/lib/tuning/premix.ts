// Two-stroke premix: oil by volume to fuel, R:1.
import { between, nonNegative, positive } from './check';

/** Oil for a quantity of fuel at R:1, ml: 1000·L/R (50:1 is 20 ml a litre). */
export function premixOilMl(fuelLitres: number, ratio: number): number {
	positive('fuelLitres', fuelLitres);
	between('ratio', ratio, 10, 200);
	return (1000 * fuelLitres) / ratio;
}

/**
 * Topping up a tank that holds `tankLitres` of mix at currentRatio:1 with `addLitres` of fresh
 * fuel, to reach targetRatio:1. What is in the tank splits by volume, fuel R/(R + 1) and oil
 * 1/(R + 1); the oil to add is what the new fuel total needs at the target less what is there.
 * A target that needs oil taken out (the tank already holds more than the target allows) is
 * refused: add more fuel instead.
 */
export function premixTopUp(input: {
	tankLitres: number;
	currentRatio: number;
	addLitres: number;
	targetRatio: number;
}): { oilMl: number } {
	if (!input || typeof input !== 'object') throw new RangeError('input must be an object');
	const tank = nonNegative('tankLitres', input.tankLitres);
	const r0 = between('currentRatio', input.currentRatio, 10, 200);
	const add = nonNegative('addLitres', input.addLitres);
	const rt = between('targetRatio', input.targetRatio, 10, 200);
	const fuel = (tank * r0) / (r0 + 1) + add;
	const oil = tank / (r0 + 1);
	const oilMl = 1000 * (fuel / rt - oil);
	if (oilMl < -1e-9)
		throw new RangeError(
			`targetRatio ${rt}:1 needs less oil than the tank already holds: add at least ${(oil * rt - fuel).toFixed(2)} more litres of fuel`
		);
	return { oilMl: Math.max(0, oilMl) };
}
