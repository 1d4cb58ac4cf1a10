import { finding, type Finding } from './findings';
import { INCOMPRESSIBLE_MACH_LIMIT } from './flow';
import type { SpeedCondition } from './speed-conditions';

/** The facility's limits a plan is checked against. */
export type FacilityEnvelope = {
	minSpeed_mps: number;
	maxSpeed_mps: number;
	maxDynamicPressure_Pa: number;
	yawMin_deg: number;
	yawMax_deg: number;
};

/** A speed as the findings quote it: to 0.1 m/s, without a trailing ".0". */
const speedText = (speed_mps: number) => String(+speed_mps.toFixed(1));

/**
 * Speeds and yaw angles the facility cannot set at all: outside its speed range or its
 * turntable. A campaign that asks for one cannot be saved against that facility.
 */
export function settingFindings(
	speeds_mps: readonly number[],
	yawAngles_deg: readonly number[],
	envelope: FacilityEnvelope
): Finding[] {
	const notes: Finding[] = [];
	for (const speed_mps of speeds_mps) {
		const v = speedText(speed_mps);
		if (speed_mps > envelope.maxSpeed_mps) {
			notes.push(
				finding(
					'limit',
					'speed-above-envelope',
					`${v} m/s is above the facility's maximum of ${envelope.maxSpeed_mps} m/s.`,
					speed_mps
				)
			);
		} else if (speed_mps < envelope.minSpeed_mps) {
			notes.push(
				finding(
					'limit',
					'speed-below-envelope',
					`${v} m/s is below the facility's minimum of ${envelope.minSpeed_mps} m/s.`,
					speed_mps
				)
			);
		}
	}
	for (const yaw of yawAngles_deg) {
		if (yaw < envelope.yawMin_deg || yaw > envelope.yawMax_deg) {
			notes.push(
				finding(
					'limit',
					'yaw-outside-turntable',
					`Yaw ${yaw}° is outside the turntable's ${envelope.yawMin_deg}° to ${envelope.yawMax_deg}°.`
				)
			);
		}
	}
	return notes;
}

/** The flow at each speed against the facility's q limit and the incompressible Mach limit. */
export function flowFindings(conditions: SpeedCondition[], envelope: FacilityEnvelope): Finding[] {
	const notes: Finding[] = [];
	for (const c of conditions) {
		const v = speedText(c.speed_mps);
		// The facility's limit is on the q the tunnel is set to; the blockage-corrected q is what
		// the model feels, not what the fan and the structure see.
		if (c.dynamicPressure_Pa > envelope.maxDynamicPressure_Pa) {
			notes.push(
				finding(
					'limit',
					'q-above-envelope',
					`At ${v} m/s, q = ${c.dynamicPressure_Pa.toFixed(0)} Pa (as set, before blockage correction) is above the facility's maximum of ${envelope.maxDynamicPressure_Pa} Pa.`,
					c.speed_mps
				)
			);
		}
		if (c.mach > INCOMPRESSIBLE_MACH_LIMIT) {
			notes.push(
				finding(
					'limit',
					'mach-compressible',
					`At ${v} m/s the Mach number is ${c.mach.toFixed(2)}, above ${INCOMPRESSIBLE_MACH_LIMIT}.`,
					c.speed_mps
				)
			);
		}
	}
	return notes;
}

/** Every finding for speeds, q, Mach and yaw against the facility's envelope. */
export function envelopeFindings(
	yawAngles_deg: readonly number[],
	conditions: SpeedCondition[],
	envelope: FacilityEnvelope
): Finding[] {
	return [
		...settingFindings(
			conditions.map((c) => c.speed_mps),
			yawAngles_deg,
			envelope
		),
		...flowFindings(conditions, envelope)
	];
}
