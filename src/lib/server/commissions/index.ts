export {
	cancel,
	createDraft,
	editOpen,
	expire,
	publish,
	reopenAfterCancelledOrder,
	updateDraft,
	type Actor
} from './transitions';
export { expireDue } from './expiry';
export { award, lockForDecision } from './award';
export { publishedTimes } from './published';
export {
	customerTimeZone,
	firstNameAndInitial,
	getForOwner,
	getForViewer,
	listForCustomer,
	listOpen,
	readiness,
	type CommissionView,
	type Viewer
} from './queries';
export { missingForPublish, missingMeasurements, stepOfField, type StepId } from './completeness';
export { profilesOf, snapshotFor } from './profile-snapshot';
export { CommissionError, errorStatus, type CommissionIssue } from './errors';
export { leadTimeWarning, todayIn, typicalLeadDays } from './lead-times';
export { fabricEstimateForBand } from './estimate';
export * as schemas from './schemas';
export * as searchDocuments from './search-documents';
export type { CommissionCard, CommissionSort, NearbyCommissionFilters } from './search-documents';
