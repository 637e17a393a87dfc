// Just the psychrolib functions the tests use as an outside reference (the package ships no types).
declare module 'psychrolib' {
	const psychrolib: {
		SI: number;
		IP: number;
		SetUnitSystem(system: number): void;
		GetSatVapPres(tC: number): number;
		GetHumRatioFromRelHum(tC: number, rh: number, pPa: number): number;
		GetMoistAirDensity(tC: number, humRatio: number, pPa: number): number;
		GetStandardAtmPressure(altitudeM: number): number;
		GetStandardAtmTemperature(altitudeM: number): number;
	};
	export default psychrolib;
}
