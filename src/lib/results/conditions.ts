import { airState, machNumber, pitotSpeed, propagateUncertainty, reynoldsNumber } from '../calc';
import type { InstrumentUncertainties, MeasuredConditions } from './input';
import type { RunConditions } from './types';

/** The run's air by CIPM-2007, its speed from the reference q, achieved Re and Mach. */
export function runConditions(
	c: MeasuredConditions,
	planned: { speed_mps: number; modelRe: number; mach: number },
	lengthRef_m: number,
	instrument: InstrumentUncertainties
): RunConditions {
	// The reference q's uncertainty is a fraction of it (the facility's calibration).
	const uQ_Pa = instrument.referenceQUncertainty * c.referenceDynamicPressure_Pa;
	const inputs = [
		{ name: 'q', value: c.referenceDynamicPressure_Pa, standardUncertainty: uQ_Pa },
		{
			name: 'T',
			value: c.airTemperature_K,
			standardUncertainty: instrument.temperatureUncertainty_K
		},
		{
			name: 'p',
			value: c.barometricPressure_Pa,
			standardUncertainty: instrument.barometricUncertainty_Pa
		},
		{
			name: 'h',
			value: c.relativeHumidity ?? 0,
			standardUncertainty: c.relativeHumidity === null ? 0 : instrument.humidityUncertainty
		}
	];
	const clampHumidity = (h: number) => Math.min(1, Math.max(0, h));
	const air = (x: Record<string, number>) =>
		airState({ temperature_K: x.T!, pressure_Pa: x.p!, relativeHumidity: clampHumidity(x.h!) });
	const speed = (x: Record<string, number>) => pitotSpeed(x.q!, air(x).density_kgm3);
	const re = (x: Record<string, number>) => reynoldsNumber(speed(x), lengthRef_m, air(x));
	const density = propagateUncertainty((x) => air(x).density_kgm3, inputs);
	const measured = propagateUncertainty(speed, inputs);
	const achievedRe = propagateUncertainty(re, inputs);
	const nominal = air(Object.fromEntries(inputs.map((i) => [i.name, i.value])));
	return {
		...c,
		density_kgm3: density.value,
		measuredSpeed_mps: measured.value,
		achievedRe: achievedRe.value,
		achievedMach: machNumber(measured.value, nominal),
		plannedSpeed_mps: planned.speed_mps,
		plannedRe: planned.modelRe,
		plannedMach: planned.mach,
		uncertainty: {
			referenceDynamicPressure_Pa: uQ_Pa,
			density_kgm3: density.standardUncertainty,
			measuredSpeed_mps: measured.standardUncertainty,
			achievedRe: achievedRe.standardUncertainty
		}
	};
}
