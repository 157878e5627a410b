export * from './schemas';
export { send, edit, withdraw, lapse, lapseDue, type Actor } from './transitions';
export {
	getForParty,
	latestQuoteOf,
	listForCommission,
	listOwn,
	liveQuoteOf,
	ownPageSize,
	quoteJson,
	type QuoteJson,
	type QuoteViewer
} from './queries';
export { prefill, quoteContext, startingFabricPricePerMetre, type HelperFacts, type HelperPrefill } from './helper';
export {
	capacityWindowDays,
	countAround,
	quoteWarnings,
	warningsFor,
	type QuoteWarning,
	type WarningFacts
} from './warnings';
export * from './errors';
export * from './decide';
export { acceptResponse, quoteListResponse, quoteResponse, type AcceptResponse } from './response-schemas';
export * from './compare';
export { fitMethod, formatKm } from './fit';
export { reopenAfterCancelledOrder, orderCancelledBeforePayment } from './reopen';
