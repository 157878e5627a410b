export * from './errors';
export * from './schemas';
export type { Actor, Reader, Side } from './context';
export { offer, book, cancel, markDone, changeableUntil } from './transitions';
export {
	listForOrder,
	getForParty,
	calendarForParty,
	summaryFor,
	type FittingView,
	type FittingsPage
} from './queries';
export type { FittingsSummary } from '$lib/types/fittings';
export { sendDueReminders } from './reminders';
export { fittingCalendar, fittingUid } from './ics';
export { fittingJson, fittingResponse, fittingListResponse, type FittingJson } from './response-schemas';
