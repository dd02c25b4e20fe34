/** @deprecated The CSV helpers live in common/csv.ts; this re-export is kept for publishing until it imports them from there. */
export { neutraliseCell, parseCsv, readCsvBody, toCsv } from '../common/csv';
