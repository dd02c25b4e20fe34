import type { CsvImportResult } from '@rotaplex/contracts';
import { buildUrl, type QueryValue } from '@/api/client';
import { ApiRequestError, toApiError } from '@/api/errors';
import { authorisedFetch, responseError, saveFile } from '@/api/files';

// CSV goes to and from the API as plain text, which the shared JSON client does not send or read.

function isImportResult(body: unknown): body is CsvImportResult {
  return (
    !!body &&
    typeof body === 'object' &&
    Array.isArray((body as CsvImportResult).errors) &&
    typeof (body as CsvImportResult).rows === 'number'
  );
}

/**
 * Posts CSV text. A dry run answers with the row errors; a real import with a bad row answers 400
 * with the same report (nothing saved), which is returned rather than thrown so the preview can show it.
 */
export async function sendCsv(
  path: string,
  csv: string,
  query: Record<string, QueryValue>,
): Promise<CsvImportResult> {
  const response = await authorisedFetch(buildUrl(path, query), {
    method: 'POST',
    headers: { 'Content-Type': 'text/csv', Accept: 'application/json' },
    body: csv,
  });
  const text = await response.text();
  let body: unknown = text;
  try {
    body = text ? (JSON.parse(text) as unknown) : undefined;
  } catch {
    // Not JSON: keep the text for the error message.
  }
  if (isImportResult(body) && (response.ok || response.status === 400)) {
    return { dryRun: body.dryRun, rows: body.rows, saved: body.saved, errors: body.errors };
  }
  throw new ApiRequestError(toApiError(response.status, response.statusText, body));
}

/** Fetches a CSV export with the access token and hands it to the browser as a file download. */
export async function downloadText(
  path: string,
  query: Record<string, QueryValue>,
  fileName: string,
): Promise<void> {
  const response = await authorisedFetch(buildUrl(path, query), { headers: { Accept: 'text/csv' } });
  if (!response.ok) throw await responseError(response);
  saveFile(await response.blob(), fileName);
}
