/** The state of the air a calculation works in; every quantity SI. */
export type AirState = {
	temperature_K: number;
	pressure_Pa: number;
	density_kgm3: number;
	speedOfSound_mps: number;
	dynamicViscosity_Pas: number;
	kinematicViscosity_m2s: number;
};
