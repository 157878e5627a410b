export function getRequestEvent() {
	throw new Error('not inside a request');
}
