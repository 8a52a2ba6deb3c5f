import { uploadField } from '../../../../shared/uploads/uploads';
import { ApiError } from '../../../lib/api-client';

/**
 * Multipart uploads go beside the JSON client (which only sends JSON): the same CSRF header, the same errors.
 * The browser sets the multipart boundary itself, so no Content-Type is given here.
 */
export async function sendFile<T>(path: string, file: File): Promise<T> {
  const { token } = (await (await fetch('/api/auth/csrf', { credentials: 'same-origin' })).json()) as { token: string };
  const body = new FormData();
  body.append(uploadField, file, file.name);
  const response = await fetch(path, { method: 'POST', body, credentials: 'same-origin', headers: { Accept: 'application/json', 'X-CSRF-Token': token } });
  const payload = await response.json().catch(() => null);
  if (!response.ok) {
    const { code, message, fields, ...extra } = payload?.error ?? {};
    throw new ApiError(response.status, code ?? 'http_error', message ?? `Upload failed (${response.status}).`, fields, extra);
  }
  return payload as T;
}
