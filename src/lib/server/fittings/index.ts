export * from './errors';
export * from './schemas';
export type { Actor, Side } from './context';
export { offer, book, cancel, markDone, changeableUntil } from './transitions';
export {
	listForOrder,
	getForParty,
	calendarForParty,
	summaryFor,
	type FittingView,
	type FittingsPage,
	type FittingsSummary
} from './queries';
export { sendDueReminders } from './reminders';
export { fittingCalendar, fittingUid } from './ics';
export { fittingJson, fittingResponse, fittingListResponse, type FittingJson } from './response-schemas';
