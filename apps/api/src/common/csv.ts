import { PayloadTooLargeException } from '@nestjs/common';
import { type Request } from 'express';
import { type CsvRowError } from '@rotaplex/contracts';
import { CsvError, parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';

/** A data row of an uploaded CSV: its line in the file and its cells by (lower-cased) column name. */
export interface CsvRow {
  line: number;
  cells: Record<string, string>;
}

export interface ParsedCsv {
  rows: CsvRow[];
  errors: CsvRowError[];
}

/** Largest upload accepted (rows), to keep a request short. */
export const MAX_CSV_ROWS = 5000;

/**
 * Parses CSV text with a header line. Column names are matched case-insensitively against `columns`;
 * `required` columns must be present, unknown columns are an error. Blank lines are skipped; cells
 * are trimmed, and the quote that neutralised a formula on export is removed. Errors carry the 1-based line number in the file (line 1 is the header).
 */
export function parseCsv(text: string, columns: readonly string[], required: readonly string[]): ParsedCsv {
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, {
      bom: true,
      skip_empty_lines: true,
      relax_column_count: true,
      trim: true,
      info: true,
    }) as unknown as { record: string[]; info: { lines: number } }[];
  } catch (err) {
    const line = err instanceof CsvError && typeof err.lines === 'number' ? err.lines : 0;
    return {
      rows: [],
      errors: [{ line, field: 'file', message: `not valid CSV: ${(err as Error).message}` }],
    };
  }
  if (!records.length)
    return { rows: [], errors: [{ line: 1, field: 'file', message: 'the file is empty' }] };
  const [header, ...data] = records;
  const names = header.record.map((h) => h.trim());
  const known = new Map(columns.map((c) => [c.toLowerCase(), c]));
  const errors: CsvRowError[] = [];
  names.forEach((n) => {
    if (!known.has(n.toLowerCase())) {
      errors.push({
        line: header.info.lines,
        field: n || '(empty)',
        message: `unknown column; the columns are ${columns.join(', ')}`,
      });
    }
  });
  for (const r of required) {
    if (!names.some((n) => n.toLowerCase() === r.toLowerCase())) {
      errors.push({ line: header.info.lines, field: r, message: 'required column is missing' });
    }
  }
  if (data.length > MAX_CSV_ROWS) {
    errors.push({ line: 0, field: 'file', message: `at most ${MAX_CSV_ROWS} rows per upload` });
  }
  if (errors.length) return { rows: [], errors };
  const rows = data.map(({ record, info }) => {
    const cells: Record<string, string> = {};
    names.forEach((n, i) => (cells[known.get(n.toLowerCase())!] = unneutraliseCell(record[i] ?? '')));
    if (record.length > names.length) cells['__extra'] = String(record.length - names.length);
    return { line: info.lines, cells };
  });
  for (const row of rows) {
    if (row.cells['__extra']) {
      errors.push({
        line: row.line,
        field: 'file',
        message: `${row.cells['__extra']} more cell(s) than columns`,
      });
    }
  }
  return { rows, errors };
}

/**
 * Neutralises spreadsheet formula injection (OWASP "CSV Injection"): a cell that starts with
 * = + - @ tab or carriage return is prefixed with a single quote so spreadsheets show it as text.
 */
export function neutraliseCell(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** Undoes {@link neutraliseCell} on upload, so an exported file imports back unchanged. */
export function unneutraliseCell(value: string): string {
  return /^'[=+\-@\t\r]/.test(value) ? value.slice(1) : value;
}

/** CSV text (RFC 4180 quoting, CRLF line ends) of a header and rows, every cell neutralised. */
export function toCsv(header: readonly string[], rows: (string | number | boolean | null)[][]): string {
  return stringify(
    [header as string[], ...rows.map((r) => r.map((c) => neutraliseCell(c === null ? '' : String(c))))],
    { record_delimiter: '\r\n', quoted_match: /[\r\n]/ },
  );
}

/** Largest CSV upload accepted, in bytes. */
export const MAX_CSV_BYTES = 2 * 1024 * 1024;

/**
 * The text of a text/csv (or text/plain) request body, read from the request stream (the global
 * body parsers leave these types unread). Other content types give back the parsed body, which the
 * services reject with a clear message.
 */
export async function readCsvBody(req: Request): Promise<unknown> {
  if (!req.is(['text/csv', 'text/plain'])) return req.body as unknown;
  if (typeof req.body === 'string') return req.body;
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req as AsyncIterable<Buffer>) {
    size += chunk.length;
    if (size > MAX_CSV_BYTES)
      throw new PayloadTooLargeException(`CSV uploads are limited to ${MAX_CSV_BYTES} bytes`);
    chunks.push(chunk);
  }
  return Buffer.concat(chunks)
    .toString('utf8')
    .replace(/^\uFEFF/, '');
}
