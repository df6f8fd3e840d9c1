import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CalendarBody, CalendarView } from '@shared/schemas/calendar';
import { calendarKeys } from './calendar-keys';

export const calendarQueryOptions = () => queryOptions({ queryKey: calendarKeys.view(), queryFn: () => api.get<CalendarView>('/calendar') });
export const useCalendar = () => useQuery(calendarQueryOptions());

export function useSaveCalendar() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CalendarBody) => api.put<CalendarView>('/calendar', body),
    onSuccess: (view) => qc.setQueryData(calendarKeys.view(), view),
  });
}
