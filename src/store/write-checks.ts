// What only a write (or a record's history) needs: the record functions of log/, which validate a body, and the
// gate every record passes.
// Loaded on the first write by load-write-checks.ts, not with the store: opening the app and reading the log
// need none of it, and the first screen's code stays small.
export { assertGateRecords, createRecord, deleteRecord, gateLookups, gateRecords, mergeRecord, recordHistory, restoreRecord, reviseRecord, undoSteps } from '../log';
