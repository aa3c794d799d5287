import type { CreateGameDayInput, GameDayPrepRow } from '@swardwise/domain';
import { api } from './client.ts';

/** Without dates the API answers from today for two months. */
export interface GameDayQuery {
  from?: string;
  to?: string;
  fieldId?: number;
  districtId?: number;
}

export async function listGameDays(query: GameDayQuery, signal?: AbortSignal): Promise<GameDayPrepRow[]> {
  return (await api.get<{ items: GameDayPrepRow[] }>('/game-days', { ...query }, signal)).items;
}

export async function createGameDay(eventId: number, input: CreateGameDayInput): Promise<GameDayPrepRow> {
  return (await api.post<{ gameDay: GameDayPrepRow; emailed: number }>(`/game-days/events/${eventId}`, input)).gameDay;
}

/** The checklist PDF, opened by the browser with the session cookie. */
export const gameDayChecklistUrl = (id: number) => `/api/game-days/${id}/checklist.pdf`;
