import { z } from 'zod';
import { canonicalTimeZone } from '$lib/format/time-zones';
import { text } from '../forms';

export const minDurationMinutes = 15;
export const maxDurationMinutes = 180;
export const maxSlotsPerOffer = 6;
export const maxOpenSlotsPerOrder = 12;

/**
 * Where fittings happen: the workroom, or a public place the tailor names. A customer's home is left out on
 * purpose — meeting at a known, public address is the safer default for both people.
 */
export const fittingPlaces = ['workroom', 'public_place'] as const;
export type OfferedPlace = (typeof fittingPlaces)[number];

export const localStart = z
	.string({ error: 'Give the start as a date and time, like 2026-12-10T14:30.' })
	.regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'Give the start as a date and time, like 2026-12-10T14:30.')
	.meta({ description: 'Wall-clock start in the offer’s time zone (no offset), e.g. 2026-12-10T14:30.' });

const minutes = (number: z.ZodNumber | z.ZodCoercedNumber) =>
	number
		.int('Give the length in whole minutes.')
		.min(minDurationMinutes, `A fitting takes at least ${minDurationMinutes} minutes.`)
		.max(maxDurationMinutes, `A fitting takes at most ${maxDurationMinutes} minutes.`);
const duration = minutes(z.number({ error: 'Give the length in minutes.' }));

export const timeZone = z
	.string({ error: 'Give the time zone as an IANA name such as Europe/London.' })
	.transform((zone, ctx) => {
		const canonical = canonicalTimeZone(zone);
		if (!canonical) {
			ctx.addIssue({ code: 'custom', message: 'Give the time zone as an IANA name such as Europe/London.' });
			return z.NEVER;
		}
		return canonical;
	})
	.meta({ type: 'string', description: 'IANA time zone, e.g. Europe/London.' });

const place = z.enum(fittingPlaces, { error: 'Choose the workroom or a public place.' });
export const addressText = text({ max: 200 });
export const notesText = text({ max: 500, multiline: true });

function needsAddress(slot: { placeKind: OfferedPlace; address: string }, ctx: z.RefinementCtx) {
	if (slot.placeKind === 'public_place' && !slot.address)
		ctx.addIssue({
			code: 'custom',
			path: ['address'],
			message: 'Name the public place and its address (a café, a library, a shop).'
		});
}

export const slotRequest = z
	.strictObject({
		start: localStart,
		durationMinutes: duration,
		placeKind: place.default('workroom'),
		address: addressText.default('').meta({
			description:
				'For the workroom: directions or the street address (the workroom’s town is used when empty). For a public place: its name and address.'
		}),
		notes: notesText.default('')
	})
	.superRefine(needsAddress);
export type SlotRequest = z.output<typeof slotRequest>;

/** The body of `POST /api/v1/orders/{id}/fittings`: one to six times, in the tailor’s zone unless `timeZone` says. */
export const offerRequest = z.strictObject({
	timeZone: timeZone.optional(),
	slots: z
		.array(slotRequest)
		.min(1, 'Offer at least one time.')
		.max(maxSlotsPerOffer, `Offer at most ${maxSlotsPerOffer} times at once.`)
});
export type OfferRequest = z.output<typeof offerRequest>;

/** The body of `POST /api/v1/fittings/{id}/cancel`; a tailor cancelling a booked fitting must give a reason. */
export const cancelRequest = z.strictObject({ reason: text({ max: 500, multiline: true }).optional() });
export type CancelRequest = z.output<typeof cancelRequest>;

export const formRows = Array.from({ length: maxSlotsPerOffer }, (_, i) => i);

const optionalDate = z
	.string()
	.trim()
	.regex(/^(\d{4}-\d{2}-\d{2})?$/, 'Give the date as YYYY-MM-DD.')
	.default('');
const optionalTime = z
	.string()
	.trim()
	.regex(/^(\d{2}:\d{2})?$/, 'Give the time as HH:MM.')
	.default('');

/** The offer form: up to six date/time rows (blank rows are skipped) sharing one length, place and note. */
export const offerForm = z
	.object({
		timeZone,
		durationMinutes: minutes(z.coerce.number({ error: 'Give the length in minutes.' })),
		placeKind: place,
		address: addressText.default(''),
		notes: notesText.default(''),
		...Object.fromEntries(
			formRows.flatMap((i) => [
				[`date_${i}`, optionalDate],
				[`time_${i}`, optionalTime]
			])
		)
	})
	.superRefine((form, ctx) => {
		needsAddress(form, ctx);
		const values = form as unknown as Record<string, string>;
		let any = false;
		for (const i of formRows) {
			const date = values[`date_${i}`];
			const time = values[`time_${i}`];
			if (date && !time) ctx.addIssue({ code: 'custom', path: [`time_${i}`], message: 'Add the time too.' });
			if (time && !date) ctx.addIssue({ code: 'custom', path: [`date_${i}`], message: 'Add the date too.' });
			if (date && time) any = true;
		}
		if (!any) ctx.addIssue({ code: 'custom', path: ['date_0'], message: 'Give at least one date and time.' });
	});

/** The offer form's fields as the API's request, and which form row each slot came from. */
export function offerFromForm(form: z.output<typeof offerForm>): { request: OfferRequest; rows: number[] } {
	const values = form as unknown as Record<string, string>;
	const rows = formRows.filter((i) => values[`date_${i}`] && values[`time_${i}`]);
	return {
		rows,
		request: {
			timeZone: form.timeZone,
			slots: rows.map((i) => ({
				start: `${values[`date_${i}`]}T${values[`time_${i}`]}`,
				durationMinutes: form.durationMinutes,
				placeKind: form.placeKind,
				address: form.address,
				notes: form.notes
			}))
		}
	};
}

export const cancelForm = z.object({ reason: text({ max: 500, multiline: true }).default('') });
