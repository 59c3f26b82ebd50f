export { EXPORT_DIGITS, csvField, formatNumber, toCsv } from './csv';
export { MAP_CSV_HEADER, mapCsv } from './map-csv';
export { WEAK_LABELS_HEADER, weakLabelsCsv } from './weak-labels';
export { buildProvenance, PROVENANCE_SCHEMA_VERSION, type ProvenanceInput } from './provenance';
export { clusterComposition, type ClusterComposition } from './cluster-composition';
export { columnWithRole, windowColumns, type WindowColumns } from './window-columns';
