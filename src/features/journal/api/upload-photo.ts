import { ApiError, type ApiIssue } from '@/lib/api-client';
import type { PhotoOut } from '@/types/api';

// The one request that does not go through api-client: fetch cannot report upload progress, so this uses
// XMLHttpRequest, and turns every failure into the same ApiError { status, message, issues }.

export interface UploadOptions {
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

export class UploadBusyError extends ApiError {
  constructor(
    message: string,
    public retryAfterSeconds: number,
  ) {
    super(503, message);
    this.name = 'UploadBusyError';
  }
}

function parse(text: string): { photos?: PhotoOut[]; error?: string; issues?: ApiIssue[] } | null {
  try {
    return text ? JSON.parse(text) : null;
  } catch {
    return null;
  }
}

export function uploadPhoto(entryId: number, file: Blob, fileName: string, { onProgress, signal }: UploadOptions = {}): Promise<PhotoOut[]> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(new DOMException('The upload was cancelled.', 'AbortError'));
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/entries/${entryId}/photos`);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress?.(Math.min(1, e.loaded / e.total));
    };
    xhr.upload.onload = () => onProgress?.(1);
    xhr.onload = () => {
      const data = parse(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300 && data?.photos) return resolve(data.photos);
      const message = data?.error ?? `The server answered ${xhr.status}.`;
      if (xhr.status === 503) {
        const after = Number(xhr.getResponseHeader('Retry-After'));
        return reject(new UploadBusyError(message, Number.isFinite(after) && after > 0 ? after : 10));
      }
      reject(new ApiError(xhr.status, message, data?.issues ?? []));
    };
    xhr.onerror = () => reject(new ApiError(0, 'Whorlbook cannot reach the server. Check your connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    const form = new FormData();
    form.append('photos', file, fileName);
    xhr.send(form);
  });
}
