// The one way the app talks to the API: same origin, session cookie, JSON both ways, and the
// CSRF token on every state-changing request. Failures always surface as an ApiError.
import { ERROR_CODES, isErrorBody, type FieldErrors, type RuleFailure } from '@/shared/errors';
import type { SessionResponse } from '@/shared/schemas/session';

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fieldErrors: FieldErrors | undefined;
  /** Every rule a release or return failed (RELEASE_REFUSED, RETURN_REFUSED). */
  readonly failures: RuleFailure[] | undefined;

  constructor(status: number, code: string, message: string, fieldErrors?: FieldErrors, failures?: RuleFailure[]) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fieldErrors = fieldErrors;
    this.failures = failures;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions {
  method?: Method;
  /** JSON, or a FormData for file uploads (the browser sets the multipart boundary). */
  body?: unknown;
  signal?: AbortSignal;
  /** Told the share of the body sent so far (0 to 1) while an upload goes out. */
  onUploadProgress?: (fraction: number) => void;
}

/** What came back: the status and the parsed JSON body (undefined when there was none). */
interface Answer {
  status: number;
  payload: unknown;
}

const UNREACHABLE_MESSAGE = 'Voltcrib could not reach its server. Check the connection and try again.';

// The token from the last GET /api/session (the session query's fetcher records it). It changes
// at sign-in and sign-out, so those mutations forget it and the next write fetches a fresh one.
let csrfToken: string | null = null;

export function forgetCsrfToken(): void {
  csrfToken = null;
}

/** GET /api/session. The session query uses this, so the cached session and the token agree. */
export async function fetchSession(signal?: AbortSignal): Promise<SessionResponse> {
  const session = await send<SessionResponse>('/api/session', { signal });
  csrfToken = session.csrfToken;
  return session;
}

async function currentCsrfToken(signal?: AbortSignal): Promise<string> {
  if (csrfToken !== null) return csrfToken;
  return (await fetchSession(signal)).csrfToken;
}

export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const method = options.method ?? 'GET';
  if (method === 'GET') return send<T>(path, options);

  try {
    return await send<T>(path, { ...options, csrfToken: await currentCsrfToken(options.signal) });
  } catch (error) {
    // A token can go stale (session expired, signed in on another tab): fetch a fresh one and
    // try once more. Writes are not retried for any other reason.
    if (!(isApiError(error) && error.code === ERROR_CODES.csrf)) throw error;
    forgetCsrfToken();
    return send<T>(path, { ...options, csrfToken: await currentCsrfToken(options.signal) });
  }
}

async function send<T>(path: string, options: RequestOptions & { csrfToken?: string }): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['content-type'] = 'application/json';
  if (options.csrfToken !== undefined) headers['x-csrf-token'] = options.csrfToken;
  const request = {
    method: options.method ?? 'GET',
    headers,
    body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
    signal: options.signal,
  };

  let answer: Answer;
  try {
    // fetch cannot report how much of a body has gone out; XMLHttpRequest can.
    answer =
      options.onUploadProgress && typeof XMLHttpRequest !== 'undefined'
        ? await sendWithProgress(path, request, options.onUploadProgress)
        : await sendWithFetch(path, request);
  } catch (error) {
    if (error instanceof Error && error.name === 'AbortError') throw error;
    throw new ApiError(0, ERROR_CODES.unavailable, UNREACHABLE_MESSAGE);
  }

  const { status, payload } = answer;
  if (status === 204) return undefined as T;
  if (status >= 200 && status < 300) return payload as T;
  if (isErrorBody(payload)) {
    const { code, message, fieldErrors, failures } = payload.error;
    throw new ApiError(status, code, message, fieldErrors, failures);
  }
  throw new ApiError(status, fallbackCode(status), fallbackMessage(status));
}

interface OutgoingRequest {
  method: Method;
  headers: Record<string, string>;
  body: string | FormData | undefined;
  signal: AbortSignal | undefined;
}

async function sendWithFetch(path: string, request: OutgoingRequest): Promise<Answer> {
  const response = await fetch(path, { ...request, credentials: 'same-origin' });
  return { status: response.status, payload: response.status === 204 ? undefined : await response.json().catch(() => undefined) };
}

function sendWithProgress(path: string, request: OutgoingRequest, onProgress: (fraction: number) => void): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(request.method, path);
    xhr.withCredentials = true;
    for (const [name, value] of Object.entries(request.headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    const abort = () => {
      xhr.abort();
      reject(new DOMException('The upload was stopped.', 'AbortError'));
    };
    // Once answered, a later abort of the signal has nothing left to stop.
    const settle = (outcome: () => void) => {
      request.signal?.removeEventListener('abort', abort);
      outcome();
    };
    xhr.onload = () =>
      settle(() => {
        let payload: unknown;
        try {
          payload = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
        } catch {
          payload = undefined;
        }
        resolve({ status: xhr.status, payload });
      });
    xhr.onerror = () => settle(() => reject(new Error('network error')));
    if (request.signal?.aborted) return abort();
    request.signal?.addEventListener('abort', abort, { once: true });
    xhr.send(request.body ?? null);
  });
}

function fallbackCode(status: number): string {
  if (status === 401) return ERROR_CODES.unauthenticated;
  if (status === 403) return ERROR_CODES.forbidden;
  if (status === 404) return ERROR_CODES.notFound;
  if (status === 429) return ERROR_CODES.rateLimited;
  if (status === 503) return ERROR_CODES.unavailable;
  return ERROR_CODES.internal;
}

function fallbackMessage(status: number): string {
  if (status === 429) return 'Too many attempts. Wait a minute and try again.';
  if (status === 503 || status === 502 || status === 504) return UNREACHABLE_MESSAGE;
  return 'Something went wrong on the server. Try again.';
}

/**
 * POSTs a multipart form (item photos and documents, checklist photos) through the same path as
 * every write, telling `onProgress` how much has been sent.
 */
export function apiUpload<T>(path: string, form: FormData, onProgress?: (fraction: number) => void): Promise<T> {
  return apiRequest<T>(path, { method: 'POST', body: form, onUploadProgress: onProgress });
}
