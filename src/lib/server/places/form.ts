import { z } from 'zod';
import { coarsen } from '$lib/geo/coarsen';
import type { Executor } from '../db';
import { nearestPlace, placeById, searchPlaces, type Place } from './index';

/** What the place picker submits; without JavaScript only the typed name and the country arrive. */
export const placeFields = z.object({
	place_id: z
		.string()
		.max(120)
		.regex(/^(geonames:\d{1,10}|local:[\w-]{1,100}|here)$/, 'Choose a place from the list.')
		.optional()
		.or(z.literal('').transform(() => undefined)),
	place_query: z.string().trim().max(100, 'A place name is at most 100 characters.').default(''),
	place_country: z
		.string()
		.trim()
		.toUpperCase()
		.regex(/^[A-Z]{2}$/, 'Choose a country from the list.')
		.optional()
		.or(z.literal('').transform(() => undefined)),
	place_lat: z.coerce
		.number()
		.min(-90)
		.max(90)
		.optional()
		.or(z.literal('').transform(() => undefined)),
	place_lng: z.coerce
		.number()
		.min(-180)
		.max(180)
		.optional()
		.or(z.literal('').transform(() => undefined))
});
export type PlaceFields = z.infer<typeof placeFields>;

/** A place as stored beside a commission or workroom: a town's name and a point no finer than ~1 km. */
export interface ChosenPlace {
	id: string;
	name: string;
	admin: string;
	country: string;
	lat: number;
	lng: number;
}

export type PlaceResolution = { ok: true; place: ChosenPlace } | { ok: false; message: string };

function chosen(place: Place, point = { lat: place.lat, lng: place.lng }): ChosenPlace {
	const { lat, lng } = coarsen(point);
	return { id: place.id, name: place.name, admin: place.admin, country: place.country, lat, lng };
}

/** A point someone gave (the browser's location, an API client): coarsened, named after the nearest place. */
export async function placeFromPoint(db: Executor, point: { lat: number; lng: number }): Promise<PlaceResolution> {
	const near = await nearestPlace(db, coarsen(point));
	if (!near) return { ok: false, message: 'We could not find a town near that point.' };
	return { ok: true, place: { ...chosen(near, point), id: 'here' } };
}

/**
 * Turns the picker's fields into a place: a chosen list entry, the browser's location, or (without
 * JavaScript) the best match for the typed name within the chosen country.
 */
export async function resolveFormPlace(db: Executor, fields: PlaceFields): Promise<PlaceResolution> {
	if (fields.place_id === 'here') {
		if (fields.place_lat === undefined || fields.place_lng === undefined)
			return { ok: false, message: 'Your location did not arrive. Type the name of your town instead.' };
		return placeFromPoint(db, { lat: fields.place_lat, lng: fields.place_lng });
	}
	if (fields.place_id) {
		const place = await placeById(db, fields.place_id);
		if (place) return { ok: true, place: chosen(place) };
	}
	if (!fields.place_query) return { ok: false, message: 'Type the name of your town and choose it from the list.' };
	const [best] = await searchPlaces(db, { q: fields.place_query, country: fields.place_country, limit: 1 });
	if (!best)
		return {
			ok: false,
			message: `We could not find a town called “${fields.place_query}”${fields.place_country ? ' in that country' : ''}. Check the spelling, or choose another country.`
		};
	return { ok: true, place: chosen(best) };
}
