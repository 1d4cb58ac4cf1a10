/**
 * A check a practitioner expects the plan to pass. `info` notes a method or assumption,
 * `caution` asks for attention, `limit` means the plan exceeds a limit as set.
 */
export type Finding = {
	level: 'info' | 'caution' | 'limit';
	code: string;
	message: string;
	/** The tunnel speed a per-speed finding is about, so pages can group a sweep's findings. */
	speed_mps?: number;
};

export const finding = (
	level: Finding['level'],
	code: string,
	message: string,
	speed_mps?: number
): Finding => ({ level, code, message, ...(speed_mps === undefined ? {} : { speed_mps }) });
