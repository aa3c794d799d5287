import type { CloseFieldInput, FieldClosureAnswer, FieldClosures, ReopenFieldInput, StatusBoard } from '@swardwise/domain';
import { api } from './client.ts';

export async function getFieldClosures(fieldId: number, signal?: AbortSignal): Promise<FieldClosures> {
  return (await api.get<{ closures: FieldClosures }>(`/fields/${fieldId}/closures`, undefined, signal)).closures;
}

export async function closeField(fieldId: number, input: CloseFieldInput): Promise<FieldClosureAnswer> {
  return api.post<FieldClosureAnswer>(`/fields/${fieldId}/closures`, input);
}

export async function reopenField(fieldId: number, input: ReopenFieldInput): Promise<FieldClosureAnswer> {
  return api.post<FieldClosureAnswer>(`/fields/${fieldId}/reopen`, input);
}

/** The public status board (no sign-in). */
export async function getStatusBoard(signal?: AbortSignal): Promise<StatusBoard> {
  return api.get<StatusBoard>('/public/status', undefined, signal);
}
