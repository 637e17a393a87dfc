// A 70 cc four-stroke-tagged kit setup and a run, for integration fixtures that build sheets by hand.
// (The demo data is all two-stroke, so four-stroke fixtures compete with nothing.)
export const FIXTURE_SETUP = {
	changeNote: 'fixture',
	isStock: false,
	bore: 47,
	stroke: 39.2,
	squish: 0.8,
	carbBore: 17,
	mainJet: 92,
	jetNumbering: 'diameter',
	needleClip: 2,
	exhaustType: 'expansion-chamber',
	rollerWeights: '6x5',
	primaryDriver: 15,
	primaryDriven: 43,
	secondaryDriver: 13,
	secondaryDriven: 47,
	rearTyre: '120/70-12',
	peakRpm: 10000,
	lubrication: 'premix',
	kitMaterial: 'cast-iron'
};

export type FixtureAir = { method?: string; temp?: number; elevation?: number };

/** A two-way closed-course run at 50 % humidity; method GPS logger, 15 °C and 200 m unless given. */
export const fixtureRun = (speed: number, a: FixtureAir = {}) => ({
	runOn: '2026-05-01',
	speed,
	method: a.method ?? 'gps-logger',
	twoWay: true,
	venue: 'closed-course',
	elevation: a.elevation ?? 200,
	temp: a.temp ?? 15,
	humidity: 50,
	pressure: null,
	pressureKind: 'sea-level',
	chtSensor: 'plug-washer',
	notes: ''
});
