export { patternPdf, testSquaresMm, type PatternPdfInput } from './pdf';
export { paperSizes, papers, ptPerMm, type Paper, type PaperId } from './paper';
export { patternPdfForRequest, type PatternPdfResult } from './request';
