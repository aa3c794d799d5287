import type {
  CloseFieldRequestInput,
  CreateFieldRequestInput,
  DeclineFieldRequestInput,
  FieldRequestDetail,
  FieldRequestPhotoAnswer,
  FieldRequestRow,
  Items,
  RequestListQuery,
  RequestMessageInput,
  ScheduleFieldRequestInput,
  UpdateFieldRequestInput,
} from '@swardwise/domain';
import { api } from './client.ts';

export async function listRequests(query: RequestListQuery, signal?: AbortSignal): Promise<FieldRequestRow[]> {
  return (await api.get<Items<FieldRequestRow>>('/requests', { ...query }, signal)).items;
}

export async function getRequest(id: number, signal?: AbortSignal): Promise<FieldRequestDetail> {
  return api.get<FieldRequestDetail>(`/requests/${id}`, undefined, signal);
}

export async function createRequest(input: CreateFieldRequestInput): Promise<FieldRequestRow> {
  return (await api.post<{ request: FieldRequestRow }>('/requests', input)).request;
}

export async function updateRequest(id: number, input: UpdateFieldRequestInput): Promise<FieldRequestRow> {
  return (await api.patch<{ request: FieldRequestRow }>(`/requests/${id}`, input)).request;
}

export async function createRequestMessage(id: number, input: RequestMessageInput): Promise<FieldRequestDetail> {
  return api.post<FieldRequestDetail>(`/requests/${id}/messages`, input);
}

export async function scheduleRequest(id: number, input: ScheduleFieldRequestInput): Promise<FieldRequestRow> {
  return (await api.post<{ request: FieldRequestRow }>(`/requests/${id}/schedule`, input)).request;
}

export async function declineRequest(id: number, input: DeclineFieldRequestInput): Promise<FieldRequestRow> {
  return (await api.post<{ request: FieldRequestRow }>(`/requests/${id}/decline`, input)).request;
}

export async function closeRequest(id: number, input: CloseFieldRequestInput): Promise<FieldRequestRow> {
  return (await api.post<{ request: FieldRequestRow }>(`/requests/${id}/close`, input)).request;
}

export async function uploadRequestPhoto(id: number, file: File): Promise<FieldRequestPhotoAnswer> {
  const form = new FormData();
  form.append('photo', file);
  return api.upload<FieldRequestPhotoAnswer>(`/requests/${id}/photos`, form);
}
