/** A failed API call, with the server's message and, for a 400, the messages per field path. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors: Record<string, string> = {},
    /** A refusal's `Retry-After`: seconds until the server takes the request again. */
    readonly retryAfterSeconds: number | null = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  /** The link dropped or the server is down: worth retrying later, unlike a refusal. */
  get isNetwork(): boolean {
    return this.status === 0;
  }
}

interface ErrorBody {
  message?: string | string[];
  issues?: { path: (string | number)[]; message: string }[];
}

export interface ApiClientOptions {
  baseUrl?: string;
  getToken: () => string | null;
  onUnauthorized?: () => void;
}

export type ApiClient = ReturnType<typeof createApiClient>;

/** A file the server sent: its bytes and its Content-Disposition header (which may name it). */
export interface ApiFile {
  blob: Blob;
  disposition: string | null;
}

export function createApiClient({ baseUrl = '/api', getToken, onUnauthorized }: ApiClientOptions) {
  async function send(method: string, path: string, body: unknown, accept: string): Promise<Response> {
    const headers: Record<string, string> = { Accept: accept };
    const token = getToken();
    if (token) headers.Authorization = `Bearer ${token}`;
    const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
    if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';

    let response: Response;
    try {
      response = await fetch(`${baseUrl}${path}`, {
        method,
        headers,
        body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      });
    } catch {
      throw new ApiError(0, 'No connection to the shop server');
    }
    if (response.status === 401) onUnauthorized?.();
    if (!response.ok) throw await toApiError(response);
    return response;
  }

  async function request<T>(method: string, path: string, body?: unknown): Promise<T> {
    const response = await send(method, path, body, 'application/json');
    if (response.status === 204) return undefined as T;
    const type = response.headers.get('content-type') ?? '';
    return (type.includes('application/json') ? await response.json() : await response.text()) as T;
  }

  return {
    get: <T>(path: string) => request<T>('GET', path),
    post: <T>(path: string, body?: unknown) => request<T>('POST', path, body),
    put: <T>(path: string, body?: unknown) => request<T>('PUT', path, body),
    patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, body),
    delete: <T>(path: string) => request<T>('DELETE', path),
    /** A download (CSV, photo): the bytes as a Blob, with the same token and errors as every call. */
    blob: async (path: string, accept = '*/*'): Promise<ApiFile> => {
      const response = await send('GET', path, undefined, accept);
      return { blob: await response.blob(), disposition: response.headers.get('content-disposition') };
    },
  };
}

async function toApiError(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => ({}))) as ErrorBody;
  const fieldErrors: Record<string, string> = {};
  for (const issue of body.issues ?? []) fieldErrors[issue.path.join('.')] ??= issue.message;
  const message = Array.isArray(body.message) ? body.message.join('; ') : body.message;
  return new ApiError(
    response.status,
    message ?? response.statusText,
    fieldErrors,
    retryAfterSeconds(response.headers.get('retry-after')),
  );
}

/** `Retry-After` as seconds from now: either form RFC 9110 §10.2.3 allows (delay-seconds or an HTTP date). */
export function retryAfterSeconds(header: string | null, nowMs = Date.now()): number | null {
  if (!header) return null;
  const text = header.trim();
  if (/^\d+$/.test(text)) return Number(text);
  const at = Date.parse(text);
  return Number.isFinite(at) ? Math.max(0, Math.ceil((at - nowMs) / 1000)) : null;
}
