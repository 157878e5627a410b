export {
	nearbyCommissions,
	nearbyWorkrooms,
	type ListSource,
	type NearbyCommission,
	type NearbyWorkroom
} from './nearby';
export { reindex, syncOutbox } from './sync';
export { browseForTailor, type BrowseOrigin } from './browse';
export { encodeCursor, decodeCursor, type ListKey } from './cursor';
export { indexes } from './indexes';
export * as schemas from './schemas';
export { commissionItem, workroomItem } from './present';
