import type { Attachment } from '../../../../shared/schemas/case';
import { ApiError, getCsrfToken, resetCsrfToken } from '../../../lib/api-client';

export interface UploadHandle {
  done: Promise<Attachment>;
  abort: () => void;
}

// What to say when the answer is not our JSON (a proxy's page, a dropped connection).
const FALLBACK: Record<number, string> = {
  0: 'The upload did not reach the Falsetrace server. Check your connection and try again.',
  413: 'The file is too large: screenshots up to 10 MB, captures up to the server\'s limit (2 GB unless set otherwise).',
  415: 'Not an accepted file: screenshots as PNG, JPEG, GIF or BMP; captures as CSV.',
};

function send(caseId: number, file: File, token: string, onProgress: (fraction: number) => void, xhr: XMLHttpRequest) {
  return new Promise<Attachment>((resolve, reject) => {
    xhr.open('POST', `/api/cases/${caseId}/attachments`);
    xhr.setRequestHeader('x-csrf-token', token);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => {
      let body: { attachment?: Attachment; error?: string; issues?: { path: string; message: string }[] } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status === 201 && body.attachment) resolve(body.attachment);
      else reject(new ApiError(xhr.status, body.error ?? FALLBACK[xhr.status] ?? `Upload failed (${xhr.status})`, body.issues ?? []));
    };
    xhr.onerror = () => reject(new ApiError(0, FALLBACK[0]));
    xhr.onabort = () => reject(new ApiError(0, 'Upload cancelled'));
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

/**
 * Uploads one screenshot or capture with progress (fetch cannot report upload progress).
 * A stale CSRF token is refreshed and the upload tried once more.
 */
export function uploadAttachment(caseId: number, file: File, onProgress: (fraction: number) => void): UploadHandle {
  let xhr = new XMLHttpRequest();
  let aborted = false;
  const attempt = async (retried: boolean): Promise<Attachment> => {
    const token = await getCsrfToken();
    if (aborted) throw new ApiError(0, 'Upload cancelled');
    try {
      return await send(caseId, file, token, onProgress, xhr);
    } catch (err) {
      if (!retried && err instanceof ApiError && err.status === 403 && /csrf/i.test(err.message)) {
        resetCsrfToken();
        xhr = new XMLHttpRequest();
        return attempt(true);
      }
      throw err;
    }
  };
  return {
    done: attempt(false),
    abort: () => {
      aborted = true;
      xhr.abort();
    },
  };
}
