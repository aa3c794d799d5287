import type { FieldCheckAnswer, FieldCheckBody, FieldGrowthCalibration, PhotoAnswer } from '@swardwise/domain';
import { api } from './client.ts';

/** Staff log a field check from the field page (no work order): stored, scored and flagged. */
export function createFieldCheck(fieldId: number, body: FieldCheckBody): Promise<FieldCheckAnswer> {
  return api.post<FieldCheckAnswer>(`/fields/${fieldId}/checks`, body);
}

/** A photo of a check logged from the field page; the reference makes a retry count once. */
export function uploadFieldCheckPhoto(fieldId: number, checkId: number, photo: Blob, name: string, clientRef: string): Promise<PhotoAnswer> {
  const form = new FormData();
  form.append('clientRef', clientRef);
  form.append('photo', photo, name);
  return api.upload<PhotoAnswer>(`/fields/${fieldId}/checks/${checkId}/photos`, form);
}

/** The field's growth against the engine's prediction. */
export async function getFieldGrowthCalibration(fieldId: number, signal?: AbortSignal): Promise<FieldGrowthCalibration> {
  return (await api.get<{ calibration: FieldGrowthCalibration }>(`/fields/${fieldId}/growth-calibration`, undefined, signal)).calibration;
}
