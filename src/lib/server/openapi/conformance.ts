/*
 * Compile-time proof that what each endpoint builds fits the response schema the document shows for it
 * (`npm run check` fails otherwise). Dates become ISO strings on the way out, as `json()` writes them.
 */
import type { z } from 'zod';
import type { DraftResponse, LayoutResponse, estimateQuoteRequest, listGarments } from '$lib/drafting';
import type {
	draftResponseSchema,
	garmentListSchema,
	layoutResponseSchema,
	quoteEstimateResponseSchema
} from '$lib/drafting/response-schemas';
import type { PhotoView, PortfolioItemView } from '$lib/types/photos';
import type { CommissionView } from '../commissions';
import type { commissionResponse } from '../commissions/response-schemas';
import type { FittingJson } from '../fittings';
import type { fittingListResponse, fittingResponse } from '../fittings/response-schemas';
import type { HealthReport } from '../health';
import type { list as listMessages, markRead, post as postMessage, threadsFor } from '../messages';
import type { markedResponse, messageDto, messagePage, threadPage } from '../messages/response-schemas';
import type { list as listNotifications, preferences as notificationPreferences } from '../notifications';
import type { notificationPage, preferencesResponse, readResponse } from '../notifications/response-schemas';
import type { healthReportSchema } from '../health/schemas';
import type { photoResponse, portfolioItemResponse } from '../photos/response-schemas';
import type { Place } from '../places/gazetteer';
import type { placeResponse } from '../places/schemas';
import type { PresentedProfile } from '../profiles';
import type { EventOutcome, OrderView, startCheckout } from '../payments';
import type { checkoutResponse, orderResponse, webhookResponse } from '../payments/response-schemas';
import type { escrowJson } from '../payments/escrow';
import type { escrowResponse } from '../payments/escrow-schemas';
import type { profileResponse } from '../profiles/response-schemas';
import type { accept, QuoteJson } from '../quotes';
import type { acceptResponse, quoteListResponse, quoteResponse } from '../quotes/response-schemas';
import type { browseForTailor, commissionItem, nearbyWorkrooms, workroomItem } from '../search';
import type {
	nearbyCommissionPage,
	nearbyCommissionResponse,
	nearbyWorkroomPage,
	nearbyWorkroomResponse
} from '../search/response-schemas';
import type { onboardingJson, ownWorkroomJson, publicWorkroomJson } from '../workrooms/api';
import type { onboardingResponse, ownWorkroomResponse, publicWorkroomResponse } from '../workrooms/response-schemas';

/** A value as it reads after `JSON.stringify` and `JSON.parse`. */
type Json<T> = T extends Date ? string : T extends object ? { -readonly [K in keyof T]: Json<T[K]> } : T;

/**
 * Keys the builder writes that the schema does not name, at any depth (`never` when there are none). Assignability
 * alone lets an extra key through, yet the document's objects refuse additional properties.
 */
type ExtraKeys<B, S, Path extends string = ''> = B extends readonly (infer BI)[]
	? NonNullable<S> extends readonly (infer SI)[]
		? ExtraKeys<BI, SI, `${Path}[]`>
		: never
	: B extends object
		? Matching<B, NonNullable<S>> extends infer SO
			? SO extends object
				? string extends keyof SO
					? never
					: {
							[K in keyof B & string]: K extends keyof SO ? ExtraKeys<B[K], SO[K], `${Path}.${K}`> : `${Path}.${K}`;
						}[keyof B & string]
				: never
			: never
		: never;

/** The members of a union schema type that the built value fits (all of them when it fits none alone). */
type Matching<B, S> = [S extends unknown ? (B extends S ? S : never) : never] extends [never]
	? S
	: S extends unknown
		? B extends S
			? S
			: never
		: never;

type Fits<Built, Schema extends z.ZodType> = [Json<Built>] extends [z.output<Schema>]
	? [ExtraKeys<Json<Built>, z.output<Schema>>] extends [never]
		? true
		: false
	: false;
type Assert<T extends true> = T;

/**
 * `commissionJson` in routes/api/v1/commissions: the view without `viewer`, measurements as `{ unit, values }`
 * (for the owner and the awarded tailor), for the viewers named.
 */
type CommissionAnswer<V extends CommissionView['viewer'] = CommissionView['viewer']> =
	Extract<CommissionView, { viewer: V }> extends infer View
		? View extends { measurements: infer M }
			? Omit<View, 'viewer' | 'measurements'> & {
					measurements: M extends { unit: infer U; values: infer V } ? { unit: U; values: V } : null;
				}
			: Omit<View, 'viewer'>
		: never;

/** What a successful `browseForTailor` gives the route. */
type Browsed = Extract<Awaited<ReturnType<typeof browseForTailor>>, { ok: true }>;

type Has<T, K extends PropertyKey> = K extends keyof T ? true : false;

export type Conformance = [
	Assert<Fits<HealthReport, typeof healthReportSchema>>,
	Assert<Fits<CommissionAnswer, typeof commissionResponse>>,
	Assert<Fits<CommissionAnswer<'awarded'>, typeof commissionResponse>>,
	Assert<Has<CommissionAnswer<'awarded'>, 'measurements'>>,
	Assert<Fits<QuoteJson, typeof quoteResponse>>,
	Assert<Fits<{ items: QuoteJson[] }, typeof quoteListResponse>>,
	Assert<Fits<Awaited<ReturnType<typeof accept>>, typeof acceptResponse>>,
	Assert<Fits<OrderView, typeof orderResponse>>,
	Assert<Fits<FittingJson, typeof fittingResponse>>,
	Assert<Fits<{ items: FittingJson[]; cutoffHours: number }, typeof fittingListResponse>>,
	Assert<Fits<{ url: Awaited<ReturnType<typeof startCheckout>>['url'] }, typeof checkoutResponse>>,
	Assert<Fits<{ received: true; outcome: EventOutcome }, typeof webhookResponse>>,
	Assert<Fits<ReturnType<typeof commissionItem>, typeof nearbyCommissionResponse>>,
	Assert<
		Fits<
			{
				items: ReturnType<typeof commissionItem>[];
				nextCursor: Browsed['nextCursor'];
				near: Browsed['origin']['near'];
				radiusKm: Browsed['origin']['radiusKm'];
			},
			typeof nearbyCommissionPage
		>
	>,
	Assert<Fits<ReturnType<typeof workroomItem>, typeof nearbyWorkroomResponse>>,
	Assert<
		Fits<
			{
				items: ReturnType<typeof workroomItem>[];
				nextCursor: Awaited<ReturnType<typeof nearbyWorkrooms>>['nextCursor'];
			},
			typeof nearbyWorkroomPage
		>
	>,
	Assert<Fits<Awaited<ReturnType<typeof threadsFor>>, typeof threadPage>>,
	Assert<Fits<Awaited<ReturnType<typeof listNotifications>>, typeof notificationPage>>,
	Assert<Fits<{ marked: number; unreadCount: number }, typeof readResponse>>,
	Assert<Fits<{ events: Awaited<ReturnType<typeof notificationPreferences.list>> }, typeof preferencesResponse>>,
	Assert<Fits<Awaited<ReturnType<typeof listMessages>>, typeof messagePage>>,
	Assert<Fits<Awaited<ReturnType<typeof postMessage>>, typeof messageDto>>,
	Assert<Fits<{ marked: Awaited<ReturnType<typeof markRead>> }, typeof markedResponse>>,
	Assert<Fits<PhotoView, typeof photoResponse>>,
	Assert<Fits<PortfolioItemView, typeof portfolioItemResponse>>,
	Assert<Fits<PresentedProfile, typeof profileResponse>>,
	Assert<Fits<Place, typeof placeResponse>>,
	Assert<Fits<ReturnType<typeof onboardingJson>, typeof onboardingResponse>>,
	Assert<Fits<ReturnType<typeof ownWorkroomJson>, typeof ownWorkroomResponse>>,
	Assert<Fits<ReturnType<typeof publicWorkroomJson>, typeof publicWorkroomResponse>>,
	Assert<Fits<DraftResponse, typeof draftResponseSchema>>,
	Assert<Fits<LayoutResponse, typeof layoutResponseSchema>>,
	Assert<Fits<ReturnType<typeof estimateQuoteRequest>, typeof quoteEstimateResponseSchema>>,
	Assert<Fits<ReturnType<typeof listGarments>, typeof garmentListSchema>>,
	Assert<Fits<ReturnType<typeof escrowJson>, typeof escrowResponse>>
];
