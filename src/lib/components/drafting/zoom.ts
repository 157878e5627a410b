/** A zoomed view of a drawing: content point p shows at (x + scale·p.x, y + scale·p.y) in its frame. */
export interface View {
	scale: number;
	x: number;
	y: number;
}

export const minScale = 1;
export const maxScale = 6;

/** Keeps the scale in range and the content covering the frame (no empty margin pulled in). */
export function clampView(view: View, frame: { width: number; height: number }): View {
	const scale = Math.min(Math.max(view.scale, minScale), maxScale);
	const clamp = (value: number, room: number) => Math.min(0, Math.max(room - room * scale, value));
	return { scale, x: clamp(view.x, frame.width), y: clamp(view.y, frame.height) };
}

/** Zoom to `scale`, keeping the content under `at` (frame coordinates) where it is. */
export function zoomAt(
	view: View,
	scale: number,
	at: { x: number; y: number },
	frame: { width: number; height: number }
): View {
	const next = Math.min(Math.max(scale, minScale), maxScale);
	const contentX = (at.x - view.x) / view.scale;
	const contentY = (at.y - view.y) / view.scale;
	return clampView({ scale: next, x: at.x - contentX * next, y: at.y - contentY * next }, frame);
}

export function panBy(view: View, dx: number, dy: number, frame: { width: number; height: number }): View {
	return clampView({ ...view, x: view.x + dx, y: view.y + dy }, frame);
}
