// What a build sheet takes from its base scooter: the build's own fields when the member picks it,
// and the stock baseline setup (the first setup) as the factory fitted it, so only what differs on
// their scooter needs typing. Values are in the sheet's stored units (metric).
import { scooterName, type BaseScooterView } from './catalogue';

export function buildFieldsFrom(s: BaseScooterView): Record<string, unknown> {
	return {
		chassis: scooterName(s),
		engineFamily: s.family.name,
		engineCycle: s.family.engineCycle,
		cooling: s.family.cooling,
		cylinderOrientation: s.family.cylinderOrientation
	};
}

export function stockBaselineFrom(s: BaseScooterView): Record<string, unknown> {
	const out: Record<string, unknown> = {
		changeNote: 'Stock baseline',
		isStock: true,
		exhaustType: 'stock',
		restrictorRemoved: false,
		bore: s.family.boreMm,
		stroke: s.family.strokeMm
	};
	const put = (k: string, v: unknown) => {
		if (v !== null && v !== undefined && v !== '') out[k] = v;
	};
	put('carbBore', s.carbBoreMm);
	put('topCvtRatio', s.cvtTopRatio);
	if (s.rollerCount && s.rollerWeightG) out.rollerWeights = `${s.rollerCount}x${s.rollerWeightG}`;
	const [first, second] = s.finalDrive;
	if (first) [out.primaryDriver, out.primaryDriven] = first;
	if (second) [out.secondaryDriver, out.secondaryDriven] = second;
	put('rearTyre', s.rearTyre);
	put('peakRpm', s.peakRpm);
	return out;
}
