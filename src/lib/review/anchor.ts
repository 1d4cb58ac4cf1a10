import type { NoteAnchor } from './types';

export function anchorLabel(anchor: NoteAnchor): string {
	switch (anchor.kind) {
		case 'general':
			return 'General';
		case 'configuration':
			return `Configuration ${anchor.id}`;
		case 'speed':
			return `Speed ${anchor.speed_mps} m/s`;
		case 'yaw':
			return `Yaw ${anchor.yaw_deg}°`;
		case 'plane':
			return `Plane ${anchor.id}`;
	}
}

/** Whether a note concerns one axis value of the editor, to show it beside that field. */
export function notesFor<T extends { anchor: NoteAnchor }>(
	notes: readonly T[],
	kind: NoteAnchor['kind']
): T[] {
	return notes.filter((n) => n.anchor.kind === kind);
}
