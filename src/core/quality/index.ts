export { dataQuality } from './data-quality';
export { DEFAULT_QUALITY_OPTIONS } from './quality.types';
export type { DataQuality, QualityIssue, QualityOptions, MissingnessReport, NearConstantIssue, CorrelatedIssue, ExtremeIssue } from './quality.types';
