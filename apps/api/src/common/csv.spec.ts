import { parse } from 'csv-parse/sync';
import { neutraliseCell, parseCsv, toCsv } from './csv';

describe('CSV helpers', () => {
  // OWASP "CSV Injection": cells beginning with = + - @ tab or carriage return get a leading quote.
  it.each(['=1+1', '+1', '-2', '@SUM(A1)', '\tx', '\rx'])('neutralises %j', (cell) => {
    expect(neutraliseCell(cell)).toBe(`'${cell}`);
  });

  it('reads a neutralised cell back as it was', () => {
    const parsed = parseCsv(toCsv(['name'], [['=1+1'], ["'quoted"]]), ['name'], ['name']);
    expect(parsed.rows.map((r) => r.cells.name)).toEqual(['=1+1', "'quoted"]);
  });

  it('leaves ordinary text alone', () => {
    expect(neutraliseCell('Robin Tallis')).toBe('Robin Tallis');
    expect(neutraliseCell('a=b')).toBe('a=b');
  });

  it('quotes commas, quotes and line breaks (RFC 4180, section 2) and reads back with csv-parse', () => {
    const text = toCsv(['name', 'note'], [['Kay, "KJ" Jones', 'line1\nline2']]);
    expect(text).toBe('name,note\r\n"Kay, ""KJ"" Jones","line1\nline2"\r\n');
    expect(parse(text)).toEqual([
      ['name', 'note'],
      ['Kay, "KJ" Jones', 'line1\nline2'],
    ]);
  });

  it('gives file line numbers, counting a quoted line break', () => {
    const parsed = parseCsv('Name,email\n"A\nB",a@x.org\n\nC,c@x.org\n', ['name', 'email'], ['name']);
    expect(parsed.errors).toEqual([]);
    expect(parsed.rows).toEqual([
      { line: 3, cells: { name: 'A\nB', email: 'a@x.org' } },
      { line: 5, cells: { name: 'C', email: 'c@x.org' } },
    ]);
  });

  it('reports unknown and missing columns and malformed CSV', () => {
    expect(parseCsv('nom\nx\n', ['name'], ['name']).errors.map((e) => e.field)).toEqual(['nom', 'name']);
    const bad = parseCsv('name\n"unterminated\n', ['name'], ['name']);
    expect(bad.errors).toEqual([expect.objectContaining({ field: 'file' })]);
  });
});
