import type { CalendarFeedCreated, CalendarFeedList, CalendarFeedSlot, CreateCalendarFeedInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function listCalendarFeeds(signal?: AbortSignal): Promise<CalendarFeedSlot[]> {
  return (await api.get<CalendarFeedList>('/calendar-feeds', {}, signal)).items;
}

export async function createCalendarFeed(input: CreateCalendarFeedInput): Promise<CalendarFeedCreated> {
  return api.post<CalendarFeedCreated>('/calendar-feeds', input);
}

export async function removeCalendarFeed(id: number): Promise<void> {
  await api.delete<void>(`/calendar-feeds/${id}`);
}
