export interface ApiIssue {
  path: string;
  message: string;
}

/** Every failed API call becomes one of these, with the server's sentence as its message. */
export class ApiError extends Error {
  constructor(
    public status: number,
    message: string,
    public issues: ApiIssue[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

type Json = Record<string, unknown> | unknown[];

export interface RequestOptions extends Omit<RequestInit, 'body'> {
  body?: Json | FormData;
  /** Query-string parameters; undefined and empty values are left out. */
  params?: Record<string, string | number | boolean | undefined | null>;
}

/** The one fetch wrapper: same-origin cookies, JSON in and out, typed errors. */
export async function api<T>(path: string, { body, params, headers, ...init }: RequestOptions = {}): Promise<T> {
  let url = `/api${path}`;
  if (params) {
    const qs = new URLSearchParams();
    for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') qs.set(k, String(v));
    const s = qs.toString();
    if (s) url += `?${s}`;
  }
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  let res: Response;
  try {
    res = await fetch(url, {
      credentials: 'same-origin',
      ...init,
      headers: { Accept: 'application/json', ...(body && !isForm ? { 'Content-Type': 'application/json' } : {}), ...headers },
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'Whorlbook cannot reach the server. Check your connection and try again.');
  }
  const text = await res.text();
  let data: unknown = null;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      data = null;
    }
  }
  if (!res.ok) {
    const d = (data ?? {}) as { error?: string; issues?: ApiIssue[] };
    throw new ApiError(res.status, d.error ?? `The server answered ${res.status}.`, d.issues ?? []);
  }
  return data as T;
}

export const apiGet = <T>(path: string, params?: RequestOptions['params'], signal?: AbortSignal) =>
  api<T>(path, { params, signal });
export const apiPost = <T>(path: string, body?: Json | FormData) => api<T>(path, { method: 'POST', body: body ?? {} });
export const apiPatch = <T>(path: string, body: Json) => api<T>(path, { method: 'PATCH', body });
export const apiPut = <T>(path: string, body: Json) => api<T>(path, { method: 'PUT', body });
export const apiDelete = <T>(path: string) => api<T>(path, { method: 'DELETE' });
