import { coarsen } from '$lib/geo/coarsen';
import type { Executor } from '../db';
import { nearestPlace, placeById, type Place } from '../places';

/** A workroom's place as given: a place of the list by id, or a point (named after the nearest place). */
export type LocationChoice = { placeId: string } | { lat: number; lng: number };

/** What a workroom stores: its town (and district, where the list has one), at about 1 km at most. */
export type WorkroomPlace = { town: string; district: string | null; country: string; lat: number; lng: number };

export class UnknownPlace extends Error {
	readonly code = 'unknown_place';
	constructor() {
		super('Choose a place from the list.');
	}
}

/** Local places with a town after their name are districts of it; gazetteer places are towns. */
function workroomPlace(place: Place, point: { lat: number; lng: number }): WorkroomPlace {
	const district = place.id.startsWith('local:') && place.admin ? place.name : null;
	return { town: district ? place.admin : place.name, district, country: place.country, ...coarsen(point) };
}

export async function resolveLocation(db: Executor, choice: LocationChoice): Promise<WorkroomPlace> {
	if ('placeId' in choice) {
		const place = await placeById(db, choice.placeId);
		if (!place) throw new UnknownPlace();
		return workroomPlace(place, place);
	}
	const place = await nearestPlace(db, coarsen(choice));
	if (!place) throw new UnknownPlace();
	return workroomPlace(place, choice);
}
