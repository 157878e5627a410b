export * from './errors';
export * from './decide';
export * from './compare';
export { fitMethod, formatKm } from './fit';
