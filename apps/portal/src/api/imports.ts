import type { ImportAnswer, ImportKind, ImportList, ImportRecord } from '@swardwise/domain';
import { api, ApiError, errorOf, UNREACHABLE } from './client.ts';

export function listImports(signal?: AbortSignal): Promise<ImportList> {
  return api.get<ImportList>('/imports', { limit: 20 }, signal);
}

export async function commitImport(id: number): Promise<ImportRecord> {
  return (await api.post<ImportAnswer>(`/imports/${id}/commit`)).import;
}

export async function undoImport(id: number): Promise<ImportRecord> {
  return (await api.post<ImportAnswer>(`/imports/${id}/undo`)).import;
}

/**
 * Uploads a file for a preview. XHR rather than fetch, because only XHR reports upload
 * progress; `onProgress` gets 0–1.
 */
export function uploadImport(kind: ImportKind, file: File, onProgress: (fraction: number) => void): Promise<ImportRecord> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/imports');
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError(0, 'network/unreachable', UNREACHABLE));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve((body as ImportAnswer).import);
      reject(errorOf(xhr.status, xhr.statusText, body));
    };
    const form = new FormData();
    form.append('kind', kind);
    form.append('file', file);
    xhr.send(form);
  });
}
