import { ApiError } from '@baytime/shared/client';

export interface UploadOptions {
  url: string;
  body: FormData;
  token: string | null;
  /** Share of the request body sent so far, 0 to 1. */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

interface ErrorBody {
  message?: string | string[];
  issues?: { path: (string | number)[]; message: string }[];
}

function toApiError(status: number, statusText: string, text: string): ApiError {
  let body: ErrorBody = {};
  try {
    body = JSON.parse(text) as ErrorBody;
  } catch {
    // not JSON: fall back on the status text
  }
  const fieldErrors: Record<string, string> = {};
  for (const issue of body.issues ?? []) fieldErrors[issue.path.join('.')] ??= issue.message;
  const message = Array.isArray(body.message) ? body.message.join('; ') : body.message;
  return new ApiError(status, message ?? (statusText || 'Upload refused'), fieldErrors);
}

/**
 * POSTs a multipart body with upload progress. fetch cannot report how much of a request body
 * has gone, so this uses XMLHttpRequest. Errors are `ApiError`s like the rest of the API's.
 */
export function postWithProgress<T>({ url, body, token, onProgress, signal }: UploadOptions): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.setRequestHeader('Accept', 'application/json');
    if (token) xhr.setRequestHeader('Authorization', `Bearer ${token}`);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress?.(1);
        try {
          resolve((xhr.responseText ? JSON.parse(xhr.responseText) : undefined) as T);
        } catch {
          resolve(xhr.responseText as T);
        }
      } else reject(toApiError(xhr.status, xhr.statusText, xhr.responseText));
    };
    xhr.onerror = () => reject(new ApiError(0, 'No connection to the shop server'));
    xhr.ontimeout = () => reject(new ApiError(0, 'The upload took too long'));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(body);
  });
}
