/**
 * Uploaded photos: checked and re-encoded (`processUpload`), stored privately, served by signed URL or
 * through `/photos/[id]/[variant]` after `openForViewer` has checked who is asking. Commission photos
 * and portfolios are their own modules (`commissionPhotos`, `portfolio`).
 */
export {
	PhotoRefused,
	maxInputPixels,
	maxUploadBytes,
	processUpload,
	refusalMessages,
	refusalStatus,
	type PhotoRefusalCode,
	type ProcessedPhoto
} from './process';
export { defaultUrlSeconds, deletePhoto, readPhoto, signedUrl, storePhoto, type PhotoKeys } from './store';
export { PhotoRuleBroken, type PhotoRuleCode } from './errors';
export { openForViewer, openVariant, photoResponse, type OpenedPhoto } from './serving';
export * as commissionPhotos from './commission-photos';
export * as portfolio from './portfolio';
export { storeUpload, type StoredPhoto, type Upload } from './stored';
