import { z } from 'zod';
import { WEEKDAYS, parseHm } from '../domain/calendar';
import { isValidTimeZone } from '../domain/time-zone';

const hm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use a time written HH:MM (24 hours)');

export const shiftSchema = z
  .strictObject({ start: hm, end: hm })
  .refine((s) => parseHm(s.start) !== parseHm(s.end), { message: 'A shift needs a length', path: ['end'] });

export const weekSchema = z.strictObject(
  Object.fromEntries(WEEKDAYS.map((d) => [d, z.array(shiftSchema).max(4)])) as Record<(typeof WEEKDAYS)[number], z.ZodArray<typeof shiftSchema>>,
);
export type WeekBody = z.infer<typeof weekSchema>;

export const dayOffSchema = z.strictObject({
  date: z.iso.date({ error: 'Use a date written YYYY-MM-DD' }),
  name: z.string().trim().max(80).default(''),
});

export const timeZoneSchema = z.string().min(1).max(64).refine(isValidTimeZone, { message: 'Unknown time zone (use a name such as Asia/Shanghai)' });

export const stationCalendarBody = z.strictObject({
  stationId: z.string().min(1),
  /** null: the station follows the factory's week */
  week: weekSchema.nullable(),
  daysOff: z.array(dayOffSchema).max(400).default([]),
});

export const calendarBody = z.strictObject({
  timeZone: timeZoneSchema,
  week: weekSchema,
  daysOff: z.array(dayOffSchema).max(400),
  stations: z.array(stationCalendarBody).max(200).default([]),
});
export type CalendarBody = z.infer<typeof calendarBody>;

export interface StationCalendarView {
  stationId: string;
  code: string;
  name: string;
  kind: string;
  /** works around the clock (set on the station) */
  continuous: boolean;
  week: WeekBody | null;
  daysOff: { date: string; name: string }[];
}

export interface CalendarView {
  timeZone: string;
  week: WeekBody;
  daysOff: { date: string; name: string }[];
  stations: StationCalendarView[];
  /** true while no week has been saved and the default week applies */
  isDefault: boolean;
}
