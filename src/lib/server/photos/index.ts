/** Uploaded photos: checked and re-encoded (`processUpload`), stored privately, served by signed URL. */
export {
	PhotoRefused,
	maxInputPixels,
	maxUploadBytes,
	processUpload,
	refusalMessages,
	type PhotoRefusalCode,
	type ProcessedPhoto
} from './process';
export { defaultUrlSeconds, deletePhoto, readPhoto, signedUrl, storePhoto, type PhotoKeys } from './store';
