import type { AirState } from './air-state';
import { dynamicPressure, machNumber, reynoldsNumber } from './flow';
import { pascalsToMmH2O } from './units';

/** What holds at one tunnel speed, whatever the configuration, yaw or probe point. */
export type SpeedCondition = {
	speed_mps: number;
	modelRe: number;
	dynamicPressure_Pa: number;
	dynamicPressure_mmH2O: number;
	mach: number;
	correctedDynamicPressure_Pa: number;
};

/** What the flow at a speed depends on: the model's reference length, the air and the blockage. */
export type FlowSetting = {
	/** Model-scale length Re is based on. */
	modelReferenceLength_m: number;
	tunnelAir: AirState;
	/** q_c/q_u from the blockage correction; 1 when none applies. */
	dynamicPressureFactor?: number;
};

/** The flow quantities at one tunnel speed. */
export function speedCondition(setting: FlowSetting, speed_mps: number): SpeedCondition {
	const q = dynamicPressure(speed_mps, setting.tunnelAir);
	return {
		speed_mps,
		modelRe: reynoldsNumber(speed_mps, setting.modelReferenceLength_m, setting.tunnelAir),
		dynamicPressure_Pa: q,
		dynamicPressure_mmH2O: pascalsToMmH2O(q),
		mach: machNumber(speed_mps, setting.tunnelAir),
		correctedDynamicPressure_Pa: q * (setting.dynamicPressureFactor ?? 1)
	};
}

/** The flow quantities at each of the plan's speeds, in the plan's order. */
export function speedConditions(plan: FlowSetting & { speeds_mps: number[] }): SpeedCondition[] {
	return plan.speeds_mps.map((speed_mps) => speedCondition(plan, speed_mps));
}
