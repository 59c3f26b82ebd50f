export { STUDY_SCHEMA_VERSION, type ClusterFlag, type Study, type StudyInput, type StudyRun } from './study.types';
export { encodeStudy, STUDY_JSON } from './encode';
export { decodeStudy } from './decode';
export { migrateStudy } from './migrate';
export { checkInputs, type InputCheck } from './check-inputs';
export { runCuration } from './run-curation';
export { crc32 } from './crc32';
export { readZip, writeZip, type ZipEntry } from './zip';
