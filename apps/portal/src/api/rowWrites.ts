import { api } from './client.ts';

/**
 * The writes every versioned row collection of the API answers alike: POST `/<path>` and
 * PATCH `/<path>/<id>` answer `{ [key]: row }` (`Answer`); DELETE `/<path>/<id>` takes the
 * version the person saw, so a stale delete gets a 409.
 */
export function rowWrites<Answer, CreateInput, UpdateInput>(path: string, key: keyof Answer) {
  return {
    create: async (input: CreateInput): Promise<Answer[keyof Answer]> => (await api.post<Answer>(`/${path}`, input))[key],
    update: async (id: number, input: UpdateInput): Promise<Answer[keyof Answer]> => (await api.patch<Answer>(`/${path}/${id}`, input))[key],
    remove: async (id: number, version: number): Promise<void> => {
      await api.delete<void>(`/${path}/${id}?version=${version}`);
    },
  };
}
