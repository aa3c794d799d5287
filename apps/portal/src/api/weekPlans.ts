import type { ConfirmAnswer, GenerateAnswer, RainOutAnswer, RainOutInput, WeekBoard } from '@swardwise/domain';
import { api } from './client.ts';

export function getWeekBoard(query: { districtId: number; weekStart: string }, signal?: AbortSignal): Promise<WeekBoard> {
  return api.get<WeekBoard>('/week-plans', query, signal);
}

/** With `dryRun` nothing is written: the answer shows what generating would change. */
export function generateWeek(body: { districtId: number; weekStart: string; dryRun: boolean }): Promise<GenerateAnswer> {
  return api.post<GenerateAnswer>('/week-plans/generate', body);
}

/**
 * Confirms the suggested crews of the week (or of one crew): planned orders with a crew become
 * assigned and pinned, and each crew lead gets one e-mail.
 */
export function confirmWeek(body: { districtId: number; weekStart: string; crewId?: number }): Promise<ConfirmAnswer> {
  return api.post<ConfirmAnswer>('/week-plans/confirm', body);
}

/** Cancels a day's open work of one crew (or every crew of the district) with the reason the crews see. */
export function rainOut(body: RainOutInput): Promise<RainOutAnswer> {
  return api.post<RainOutAnswer>('/week-plans/rain-out', body);
}
