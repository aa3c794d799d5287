import type { ImportKind } from '@swardwise/domain';
import { api, ApiError } from './client.ts';
import type { ImportListItem, ImportRecord } from './types.ts';

export async function listImports(signal?: AbortSignal): Promise<{ items: ImportListItem[]; lastCommittedId: number | null }> {
  return api.get<{ items: ImportListItem[]; lastCommittedId: number | null }>('/imports', { limit: 20 }, signal);
}

export async function getImport(id: number, signal?: AbortSignal): Promise<ImportRecord> {
  return (await api.get<{ import: ImportRecord }>(`/imports/${id}`, undefined, signal)).import;
}

export async function commitImport(id: number): Promise<ImportRecord> {
  return (await api.post<{ import: ImportRecord }>(`/imports/${id}/commit`)).import;
}

export async function undoImport(id: number): Promise<ImportRecord> {
  return (await api.post<{ import: ImportRecord }>(`/imports/${id}/undo`)).import;
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
    xhr.onerror = () => reject(new ApiError(0, 'network/unreachable', 'The server cannot be reached. Check your connection and try again.'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve((body as { import: ImportRecord }).import);
      const error = (body as { error?: { code: string; message: string; details?: { issues?: { path: string; message: string }[] } } } | undefined)?.error;
      if (error) return reject(new ApiError(xhr.status, error.code, error.message, error.details?.issues ?? []));
      // A proxy in front of the API may refuse a large body itself, with no JSON.
      reject(new ApiError(xhr.status, `http/${xhr.status}`, xhr.status === 413 ? 'The file is too large to upload.' : `The server answered ${xhr.status}.`));
    };
    const form = new FormData();
    form.append('kind', kind);
    form.append('file', file);
    xhr.send(form);
  });
}
