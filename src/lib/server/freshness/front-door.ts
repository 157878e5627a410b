/**
 * What server/private-answers.js (our own entry, in the same process) asks the app before sending a kept API
 * answer: whether the address is still within the public API's limit, counted exactly as the app counts it.
 * Until the app has opened the door, kept API answers are not sent.
 */
export type FrontDoor = { allowApi: (address: string) => Promise<boolean> };

export const frontDoorKey = Symbol.for('tackline.front-door');

export function openFrontDoor(door: FrontDoor) {
	(globalThis as Record<symbol, unknown>)[frontDoorKey] = door;
}
