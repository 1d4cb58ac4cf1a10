/**
 * A check a practitioner expects the plan to pass. `info` notes a method or assumption,
 * `caution` asks for attention, `limit` means the plan exceeds a limit as set.
 */
export type Finding = { level: 'info' | 'caution' | 'limit'; code: string; message: string };

export const finding = (level: Finding['level'], code: string, message: string): Finding => ({
	level,
	code,
	message
});
