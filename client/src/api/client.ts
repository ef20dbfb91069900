import { ApiErrorSchema } from '@shared/errors';
import { recallRead, rememberRead } from './offlineReads';

/**
 * The one typed API client. Every request goes through `request()`:
 * it attaches the bearer token, sends and parses JSON, turns the server's error shape
 * (`{ error: { code, message, fields? } }`) into an `ApiRequestError`, and applies the one 401 policy
 * (clear the session, go to sign-in, remember where to return) through the handler set in main.ts.
 */

/** An error answer from the API (or a network failure, code `network_error`). */
export class ApiRequestError extends Error {
  override readonly name = 'ApiRequestError';
  readonly status: number;
  readonly code: string;
  /** Field path (e.g. `body.email`) → message, as the server reported it. */
  readonly fields: Readonly<Record<string, string>>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiRequestError(err: unknown): err is ApiRequestError {
  return err instanceof ApiRequestError;
}

/** A message fit to show a person for any thrown value. */
export function errorMessage(err: unknown, fallback = 'Something went wrong. Please try again.'): string {
  if (err instanceof ApiRequestError) return err.message;
  return fallback;
}

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

type QueryValue = string | number | boolean | null | undefined;

export interface RequestOptions {
  body?: unknown;
  query?: Readonly<Record<string, QueryValue>>;
  /**
   * Skip the global 401 policy: for sign-in (where 401 means wrong credentials and the form shows it)
   * and for the session check at start-up (the router guard handles it).
   */
  skipAuthRedirect?: boolean;
  signal?: AbortSignal;
  /** Answer with the body as a Blob (downloads: exports, PDFs) instead of parsed JSON; errors are parsed as usual. */
  asBlob?: boolean;
  /** Extra request headers (e.g. `Idempotency-Key`); they cannot replace Accept, Authorization or Content-Type. */
  headers?: Readonly<Record<string, string>>;
  /** A POST that only computes an answer (a matchup run): it changes nothing, so cached reads stay valid. */
  readOnly?: boolean;
}

interface ClientConfig {
  getToken: () => string | null;
  onUnauthorized: () => void;
  /** After every successful write (any method but GET, unless marked `readOnly`): cached reads are out of date. */
  onWrite?: () => void;
}

let config: ClientConfig = {
  getToken: () => null,
  onUnauthorized: () => undefined,
};

/** Wire the client to the auth store and router (called once from main.ts). */
export function configureApiClient(next: ClientConfig): void {
  config = next;
}

const API_BASE = '/api';

function buildUrl(path: string, query?: RequestOptions['query']): string {
  const url = new URL(API_BASE + path, window.location.origin);
  if (query) {
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') url.searchParams.set(key, String(value));
    }
  }
  return url.pathname + url.search;
}

async function readJson(res: Response): Promise<unknown> {
  const text = await res.text();
  if (!text) return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return null;
  }
}

/** Send one request to the API and return its parsed JSON body, typed by the caller's endpoint module. */
export async function request<T>(method: HttpMethod, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { ...options.headers, Accept: 'application/json' };
  const token = config.getToken();
  if (token) headers.Authorization = `Bearer ${token}`;
  // A FormData body (file uploads) is sent as multipart; the browser sets its Content-Type with the boundary.
  const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';

  const url = buildUrl(path, options.query);
  // The reads a bowler needs at the lane keep their last answer for this token (offlineReads.ts).
  const offlinePath = method === 'GET' && token && !options.asBlob ? url.slice(API_BASE.length) : null;
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers,
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    if (offlinePath && token) {
      const copy = await recallRead(token, offlinePath);
      if (copy !== undefined) return copy as T;
    }
    throw new ApiRequestError(0, 'network_error', 'Lanewright could not be reached. Check your connection and try again.');
  }

  if (res.ok && method !== 'GET' && !options.readOnly) config.onWrite?.();
  if (res.ok && options.asBlob) return (await res.blob()) as T;
  const data = await readJson(res);
  if (res.ok) {
    if (offlinePath && token) void rememberRead(token, offlinePath, data, () => config.getToken() === token);
    return data as T;
  }

  const parsed = ApiErrorSchema.safeParse(data);
  const error = parsed.success
    ? new ApiRequestError(res.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields)
    : new ApiRequestError(res.status, 'http_error', `The server answered ${res.status}. Please try again.`);

  if (res.status === 401 && !options.skipAuthRedirect) config.onUnauthorized();
  throw error;
}

export const api = {
  get: <T>(path: string, options?: RequestOptions) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, { ...options, body }),
  delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, options),
};
