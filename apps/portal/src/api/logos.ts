import type { FieldLogo, FieldLogos, UpdateLogoInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function listFieldLogos(fieldId: number, signal?: AbortSignal): Promise<FieldLogos> {
  return (await api.get<{ logos: FieldLogos }>(`/fields/${fieldId}/logos`, undefined, signal)).logos;
}

/** Uploads an SVG or PNG logo; the server places it at the field's centre. */
export async function createFieldLogo(fieldId: number, name: string, file: File): Promise<FieldLogo> {
  const form = new FormData();
  form.append('name', name);
  form.append('logo', file);
  return (await api.upload<{ logo: FieldLogo }>(`/fields/${fieldId}/logos`, form)).logo;
}

export async function updateFieldLogo(fieldId: number, logoId: number, input: UpdateLogoInput): Promise<FieldLogo> {
  return (await api.patch<{ logo: FieldLogo }>(`/fields/${fieldId}/logos/${logoId}`, input)).logo;
}

export async function removeFieldLogo(fieldId: number, logoId: number, version: number): Promise<void> {
  await api.delete(`/fields/${fieldId}/logos/${logoId}?version=${version}`);
}
