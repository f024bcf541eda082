/**
 * Uploads a multipart form to our own server with progress events, which fetch cannot give:
 * XMLHttpRequest's upload.onprogress. Same rules as the API client: same-origin cookies, the
 * session's CSRF token, failures thrown as ApiError (with the server's whole body kept).
 */
import { ApiError, apiUrl } from '@/lib/api-client';
import { getSession } from '@/lib/auth';

/** A refused upload; `body` is the server's JSON answer (an import's report, for example). */
export class UploadError extends ApiError {
  readonly body: unknown;
  constructor(status: number, error: string, issues: { path: string; message: string }[], body: unknown) {
    super(status, error, issues);
    this.body = body;
  }
}

/** Sends `form` to `url` with POST; `onProgress` gets the share sent so far (0–1). Resolves with the JSON answer. */
export async function uploadWithProgress<T>(url: string, form: FormData, onProgress?: (sent: number) => void): Promise<T> {
  const { csrfToken } = await getSession();
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', apiUrl(url));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('X-CSRF-Token', csrfToken);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded / e.total);
    };
    xhr.upload.onload = () => onProgress?.(1);
    xhr.onerror = () => reject(new TypeError('The upload could not reach the server.'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as T);
      const b = (body ?? {}) as { error?: unknown; issues?: unknown };
      const issues = Array.isArray(b.issues) ? (b.issues as { path: string; message: string }[]) : [];
      reject(new UploadError(xhr.status, typeof b.error === 'string' ? b.error : `the upload failed (${xhr.status})`, issues, body));
    };
    xhr.send(form);
  });
}
