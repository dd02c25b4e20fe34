import type { ApiError } from '@rotaplex/contracts';

/** An error response from the API, thrown by the fetch client. */
export class ApiRequestError extends Error {
  readonly status: number;
  readonly reason: string;
  readonly messages: string[];

  constructor(body: ApiError) {
    const messages = Array.isArray(body.message) ? body.message : [body.message];
    super(messages.join('\n') || body.error || `Request failed (${body.statusCode})`);
    this.name = 'ApiRequestError';
    this.status = body.statusCode;
    this.reason = body.error;
    this.messages = messages.filter((m) => m.length > 0);
  }
}

/** Reads an ApiError body, or builds one when the server sent something else (proxy page, empty body). */
export function toApiError(status: number, statusText: string, body: unknown): ApiError {
  if (body && typeof body === 'object' && 'message' in body) {
    const candidate = body as Partial<ApiError>;
    const message = candidate.message;
    if (
      typeof message === 'string' ||
      (Array.isArray(message) && message.every((m) => typeof m === 'string'))
    ) {
      return {
        statusCode: typeof candidate.statusCode === 'number' ? candidate.statusCode : status,
        error: typeof candidate.error === 'string' ? candidate.error : statusText,
        message,
      };
    }
  }
  const fallback =
    status >= 500
      ? 'The server could not complete the request. Please try again in a moment.'
      : `The request failed (${status}${statusText ? ` ${statusText}` : ''}).`;
  return { statusCode: status, error: statusText, message: fallback };
}

export interface SplitMessages<F extends string> {
  /** First message per form field, keyed by field name. */
  fields: Partial<Record<F, string>>;
  /** Messages that name no known field, shown above the form. */
  general: string[];
}

/**
 * Sorts validation messages to the form fields they name. The server's validation pipe words each
 * message with the property path first ("email must be an email", "unitIds.0 must be a UUID") or,
 * for arrays, "each value in unitIds must be ...". Beside its field a message drops the property
 * name, which the field's label already says better ("Must be an email").
 */
export function splitMessages<F extends string>(
  messages: readonly string[],
  fields: readonly F[],
): SplitMessages<F> {
  const result: SplitMessages<F> = { fields: {}, general: [] };
  // Longest names first so "newPassword" is not claimed by a field called "new".
  const byLength = [...fields].sort((a, b) => b.length - a.length);
  for (const message of messages) {
    let match: { field: F; rest: string } | undefined;
    for (const field of byLength) {
      const each = `each value in ${field} `;
      if (message.startsWith(each)) match = { field, rest: `Each value ${message.slice(each.length)}` };
      else if (message.startsWith(`${field} `)) match = { field, rest: message.slice(field.length + 1) };
      else if (message.startsWith(`${field}.`))
        match = { field, rest: message.slice(message.indexOf(' ') + 1) };
      if (match) break;
    }
    if (!match) result.general.push(message);
    else if (result.fields[match.field] === undefined) result.fields[match.field] = sentenceCase(match.rest);
  }
  return result;
}

/** Field and general messages of any error, for forms. Non-API errors become one general message. */
export function formErrors<F extends string>(error: unknown, fields: readonly F[]): SplitMessages<F> {
  if (!error) return { fields: {}, general: [] };
  if (error instanceof ApiRequestError) return splitMessages(error.messages, fields);
  if (error instanceof Error) return { fields: {}, general: [networkMessage(error)] };
  return { fields: {}, general: ['Something went wrong.'] };
}

function networkMessage(error: Error): string {
  return error.name === 'TypeError'
    ? 'Rotaplex could not reach the server. Check your connection and try again.'
    : error.message;
}

/** One readable sentence for any error (banners, toasts). */
/** Whether the server refused the caller (403): trying again cannot help, only another role or unit. */
export function isForbidden(error: unknown): boolean {
  return error instanceof ApiRequestError && error.status === 403;
}

export function errorText(error: unknown): string {
  if (error instanceof ApiRequestError) return error.messages.map(sentenceCase).join(' ');
  if (error instanceof Error) return networkMessage(error);
  return 'Something went wrong.';
}

function sentenceCase(message: string): string {
  return message.length ? message[0].toUpperCase() + message.slice(1) : message;
}
