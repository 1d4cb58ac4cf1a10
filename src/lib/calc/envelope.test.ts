import { describe, expect, it } from 'vitest';
import {
	envelopeFindings,
	flowFindings,
	isaAtmosphere,
	settingFindings,
	speedConditions
} from './index';

const conditionsAt = (speeds_mps: number[], dynamicPressureFactor = 1) =>
	speedConditions({
		speeds_mps,
		modelReferenceLength_m: 1.1,
		tunnelAir: isaAtmosphere(0),
		dynamicPressureFactor
	});

describe('envelope findings', () => {
	it('flags speed, q, Mach and yaw outside the facility’s envelope', () => {
		const envelope = {
			minSpeed_mps: 25,
			maxSpeed_mps: 35,
			maxDynamicPressure_Pa: 600,
			yawMin_deg: -3,
			yawMax_deg: 3
		};
		const codes = envelopeFindings([0, 5], conditionsAt([20, 30, 110]), envelope).map(
			(f) => f.code
		);
		expect(codes).toEqual([
			'speed-below-envelope',
			'speed-above-envelope',
			'yaw-outside-turntable',
			'q-above-envelope',
			'mach-compressible'
		]);
		expect(envelopeFindings([0], conditionsAt([30]), envelope)).toEqual([]);
	});

	it('names the speed each per-speed finding is about, and quotes it without a trailing .0', () => {
		const [above] = settingFindings([40], [0], {
			minSpeed_mps: 10,
			maxSpeed_mps: 35,
			maxDynamicPressure_Pa: 1000,
			yawMin_deg: -3,
			yawMax_deg: 3
		});
		expect(above).toEqual({
			level: 'limit',
			code: 'speed-above-envelope',
			message: "40 m/s is above the facility's maximum of 35 m/s.",
			speed_mps: 40
		});
	});

	it('holds the q limit against the q the tunnel is set to, not the blockage-corrected q', () => {
		// q = ½ρV² at sea level, 40 m/s: 980 Pa as set (ISO 2533:1975 ρ = 1.225 kg/m³). With a
		// correction factor of 1.2 the model sees 1176 Pa, but the fan sets 980 Pa.
		const limit = {
			minSpeed_mps: 5,
			maxSpeed_mps: 50,
			maxDynamicPressure_Pa: 1000,
			yawMin_deg: -3,
			yawMax_deg: 3
		};
		const corrected = conditionsAt([40], 1.2);
		expect(flowFindings(corrected, limit).map((f) => f.code)).not.toContain('q-above-envelope');
		const over = { ...limit, maxDynamicPressure_Pa: 950 };
		expect(flowFindings(corrected, over).map((f) => f.code)).toContain('q-above-envelope');
	});
});
