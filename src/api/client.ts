/**
 * The one way the client talks to the API: typed JSON calls that throw `ApiError` with the
 * server's `{ error: { code, message, fields? } }` shape. Resource modules in src/api build on it.
 */
export interface ApiErrorBody {
  code: string;
  message: string;
  fields?: Record<string, string>;
  [extra: string]: unknown;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: ApiErrorBody,
  ) {
    super(body.message);
  }

  get code(): string {
    return this.body.code;
  }

  get fields(): Record<string, string> {
    return this.body.fields ?? {};
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Listeners told about every 401, so the session store can send the user to sign in. */
const unauthorizedListeners = new Set<() => void>();
export function onUnauthorized(listener: () => void): () => void {
  unauthorizedListeners.add(listener);
  return () => unauthorizedListeners.delete(listener);
}

async function request<T>(method: Method, path: string, body?: unknown, init: RequestInit = {}): Promise<T> {
  const isForm = body instanceof FormData;
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers: body === undefined || isForm ? { accept: 'application/json' } : { 'content-type': 'application/json', accept: 'application/json' },
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      ...init,
    });
  } catch {
    throw new ApiError(0, { code: 'network', message: 'Cannot reach Byrecast. Check your connection and try again.' });
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  const data: unknown = text ? safeJson(text) : undefined;
  if (!response.ok) {
    const error = (data as { error?: ApiErrorBody } | undefined)?.error ?? {
      code: 'http_' + response.status,
      message: `The server answered ${response.status}`,
    };
    if (response.status === 401) unauthorizedListeners.forEach((l) => l());
    throw new ApiError(response.status, error);
  }
  return data as T;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

export const http = {
  get: <T>(path: string, init?: RequestInit) => request<T>('GET', path, undefined, init),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, body),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, body),
  delete: <T = void>(path: string) => request<T>('DELETE', path),
};
