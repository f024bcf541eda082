/**
 * The one fetch wrapper every API call goes through: JSON in and out, cookies same-origin, the
 * session's CSRF token on every state-changing request, and failures thrown as ApiError.
 */

/** One field-level problem reported by the server, `path` dotted like "hardness.value". */
export interface ApiIssue {
  path: string;
  message: string;
}

/** A request the server refused or could not answer; carries its status and the server's words. */
export class ApiError extends Error {
  readonly status: number;
  readonly error: string;
  readonly issues: ApiIssue[];

  constructor(status: number, error: string, issues: ApiIssue[] = []) {
    super(error);
    this.name = 'ApiError';
    this.status = status;
    this.error = error;
    this.issues = issues;
  }
}

/** The API version the client speaks: every call goes to /api/v1/… (README, "API"). */
export const API_BASE = '/api/v1';

/**
 * The URL of an endpoint on the API version the client speaks: endpoint files name paths as
 * `/api/results`, and this sends them to `/api/v1/results`. Every request and download link
 * the client makes goes through it.
 */
export function apiUrl(path: string): string {
  return path.startsWith('/api/') && !path.startsWith(`${API_BASE}/`) ? `${API_BASE}${path.slice('/api'.length)}` : path;
}

let csrfToken: string | null = null;

/** Remember the CSRF token that came with the current session (called by the session query). */
export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

async function fetchCsrfToken(): Promise<string | null> {
  const res = await fetch(apiUrl('/api/session'), { credentials: 'same-origin', headers: { Accept: 'application/json' } });
  if (!res.ok) return null;
  const body = (await res.json()) as { csrfToken?: string };
  csrfToken = body.csrfToken ?? null;
  return csrfToken;
}

function normaliseIssues(raw: unknown): ApiIssue[] {
  if (!Array.isArray(raw)) return [];
  return raw
    .filter((i): i is { path: unknown; message: unknown } => typeof i === 'object' && i !== null)
    .map((i) => ({
      path: Array.isArray(i.path) ? i.path.join('.') : String(i.path ?? ''),
      message: String(i.message ?? 'invalid'),
    }));
}

async function toApiError(res: Response): Promise<ApiError> {
  let error = res.statusText || `request failed (${res.status})`;
  let issues: ApiIssue[] = [];
  const type = res.headers.get('content-type') ?? '';
  if (type.includes('json')) {
    try {
      const body = (await res.json()) as { error?: unknown; issues?: unknown };
      if (typeof body.error === 'string') error = body.error;
      issues = normaliseIssues(body.issues);
    } catch {
      // A malformed error body still leaves the status to act on.
    }
  }
  return new ApiError(res.status, error, issues);
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
}

/**
 * Sends a request to our own server and returns its JSON (undefined for 204).
 * Non-GET requests carry the X-CSRF-Token header; a refusal for a stale token is retried once
 * with a fresh one, because signing in or out replaces the session and its token.
 */
export async function apiRequest<T>(url: string, options: RequestOptions = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const send = async (): Promise<Response> => {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (options.body !== undefined) headers['Content-Type'] = 'application/json';
    if (method !== 'GET') {
      const token = csrfToken ?? (await fetchCsrfToken());
      if (token) headers['X-CSRF-Token'] = token;
    }
    return fetch(apiUrl(url), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  };

  let res = await send();
  if (res.status === 403 && method !== 'GET') {
    const err = await toApiError(res.clone());
    if (/csrf/i.test(err.error)) {
      await fetchCsrfToken();
      res = await send();
    }
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  if (!type.includes('json')) throw new ApiError(res.status, 'the server answered with something other than JSON');
  return (await res.json()) as T;
}

/** GET with query parameters; empty values are left out of the URL. */
export function apiGet<T>(
  url: string,
  params: Record<string, string | number | undefined | null> = {},
  signal?: AbortSignal,
): Promise<T> {
  const search = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') search.set(k, String(v));
  const qs = search.toString();
  return apiRequest<T>(qs ? `${url}?${qs}` : url, { signal });
}

/** POST a JSON body. */
export function apiPost<T>(url: string, body?: unknown): Promise<T> {
  return apiRequest<T>(url, { method: 'POST', body });
}
