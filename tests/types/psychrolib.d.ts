// psychrolib ships no types; these are the calls the tests use as an independent reference.
declare module 'psychrolib' {
	const psychrolib: {
		SI: number;
		SetUnitSystem(system: number): void;
		GetSatVapPres(dryBulb_C: number): number;
		GetHumRatioFromRelHum(dryBulb_C: number, relativeHumidity: number, pressure_Pa: number): number;
		GetMoistAirDensity(dryBulb_C: number, humidityRatio: number, pressure_Pa: number): number;
		GetStandardAtmPressure(altitude_m: number): number;
	};
	export default psychrolib;
}
