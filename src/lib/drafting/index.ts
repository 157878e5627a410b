export * from './units';
export * from './measurements';
export * from './checks';
export * from './geometry';
export type * from './pieces';
export { fits, type Fit, wearingEase } from './ease';
export {
	garments,
	getTemplate,
	templates,
	type GarmentSummary,
	type GarmentTemplate,
	type OptionSpec
} from './templates/index';
export { metricDefaultMm, optionInUnit, resolveOptions, roundMetric, type GivenOptions } from './options';
export {
	packFfdh,
	packNfdh,
	packSkyline,
	packStrip,
	type PackResult,
	type Placement,
	type RectItem,
	type Rotation
} from './layout';
export {
	defaultFabricSpec,
	defaultFabricWidth,
	estimateFabric,
	fabricWidthPresets,
	type FabricEstimate,
	type FabricSpec
} from './fabric';
export { bandFor, sizeBand, type SizeBand } from './size-band';
export * from './quote';
export { cutText, layoutSvg, pieceSvg } from './svg';
export * from './schemas';
export * from './draft';
export { estimateQuoteRequest, layoutRectangles, type LayoutResponse } from './requests';
export { listGarments, type OptionOut } from './garment-list';
