export { draftNestBudget, markerItems, nestFabricEstimate, type NestBudget } from './fabric';
export {
	defaultGapMm,
	flatteningToleranceMm,
	nestMarker,
	type MarkerItem,
	type MarkerOptions,
	type MarkerPlacement,
	type MarkerResult
} from './nest';
