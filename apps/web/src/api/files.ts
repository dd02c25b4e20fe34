import { refreshSession } from './client';
import { ApiRequestError, toApiError } from './errors';
import { session } from './session';

/**
 * A fetch for what the JSON client does not send or read (CSV text, files): it attaches the access
 * token the same way and refreshes it once on a 401.
 */
export async function authorisedFetch(url: string, init: RequestInit = {}): Promise<Response> {
  const attempt = () => {
    const headers = new Headers(init.headers);
    const token = session.getAccessToken();
    if (token) headers.set('Authorization', `Bearer ${token}`);
    return fetch(url, { ...init, headers, credentials: 'include' });
  };
  const response = await attempt();
  if (response.status !== 401) return response;
  const hadSession = session.getState().status === 'signedIn';
  if (await refreshSession()) return attempt();
  if (hadSession) session.signedOut('expired');
  return response;
}

/** The error of a failed response: its JSON problem body when it has one, else its text. */
export async function responseError(response: Response): Promise<ApiRequestError> {
  const text = await response.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text) as unknown;
  } catch {
    // Plain text body.
  }
  return new ApiRequestError(toApiError(response.status, response.statusText, body));
}

/** Hands data to the browser as a file download, through a short-lived object URL. */
export function saveFile(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
