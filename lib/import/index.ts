// The run-list import: read an upload, match its headers, build a preview with errors and a diff.

export {
  readTable,
  detectDelimiter,
  zipUnpackedBytes,
  MAX_UPLOAD_BYTES,
  MAX_DATA_ROWS,
  MAX_XLSX_UNPACKED_BYTES,
} from "./read-table";
export {
  matchHeaders,
  resolveHeader,
  normaliseHeader,
  unitHintFromText,
  columnLetter,
  findDuplicates,
  knownHeaderSpellings,
} from "./header-match";
export { buildPreview } from "./preview";
export { diffRuns, runChanges, wireIdKey, type IncomingRun } from "./diff";
export * from "./types";
