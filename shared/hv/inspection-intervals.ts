import { RETEST_INTERVALS } from './data/osha';
import type { Marker } from './data/types';
import { HvInputError } from './errors';
import { requireOneOf } from './validate';

export type RetestEquipment = keyof typeof RETEST_INTERVALS;
export const RETEST_EQUIPMENT = Object.keys(RETEST_INTERVALS) as RetestEquipment[];

/** A calendar date as an ISO string, YYYY-MM-DD. Dates, not instants: no time zone involved. */
export type IsoDate = string;

interface CalendarDate {
  readonly year: number;
  readonly month: number; // 1-12
  readonly day: number;
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;

function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

function daysInMonth(year: number, month: number): number {
  return month === 2 && isLeapYear(year) ? 29 : (DAYS_IN_MONTH[month - 1] ?? 31);
}

export function parseIsoDate(value: unknown, field: string): CalendarDate {
  const match = typeof value === 'string' ? ISO_DATE.exec(value) : null;
  if (match === null) throw new HvInputError(field, `${field} must be a date written YYYY-MM-DD`);
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
    throw new HvInputError(field, `${field} is not a real calendar date`);
  }
  return { year, month, day };
}

function formatIsoDate({ year, month, day }: CalendarDate): IsoDate {
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/**
 * Adds calendar months. A day that does not exist in the target month (31 Aug + 6 months) falls
 * back to that month's last day: the earlier date, so the retest is never late.
 */
export function addCalendarMonths({ date, months }: { readonly date: IsoDate; readonly months: number }): IsoDate {
  const start = parseIsoDate(date, 'date');
  if (!Number.isInteger(months) || months < 0) throw new HvInputError('months', 'months must be a whole number, not negative');
  const zeroBased = start.month - 1 + months;
  const year = start.year + Math.floor(zeroBased / 12);
  const month = (zeroBased % 12) + 1;
  return formatIsoDate({ year, month, day: Math.min(start.day, daysInMonth(year, month)) });
}

export interface NextDueInput {
  readonly equipment: RetestEquipment;
  /** Date of the last electrical test, YYYY-MM-DD. */
  readonly lastTestDate: IsoDate;
}

export interface NextDue {
  readonly dueDate: IsoDate;
  readonly intervalMonths: number;
  readonly marker: Marker;
  readonly source: string;
}

/** Date of the next electrical retest: gloves 6 months, sleeves and blankets 12, hot sticks 24. */
export function nextDue({ equipment, lastTestDate }: NextDueInput): NextDue {
  const kind = requireOneOf(equipment, RETEST_EQUIPMENT, 'equipment');
  parseIsoDate(lastTestDate, 'lastTestDate');
  const interval = RETEST_INTERVALS[kind];
  return {
    dueDate: addCalendarMonths({ date: lastTestDate, months: interval.value }),
    intervalMonths: interval.value,
    marker: interval.marker,
    source: interval.source,
  };
}

/**
 * Whether an item is past its due date on a given day. On the due date itself the test is still
 * in time; the day after, the item must not be booked.
 */
export function isOverdue({ dueDate, onDate }: { readonly dueDate: IsoDate; readonly onDate: IsoDate }): boolean {
  parseIsoDate(dueDate, 'dueDate');
  parseIsoDate(onDate, 'onDate');
  // Zero-padded ISO dates order the same as strings and as dates.
  return onDate > dueDate;
}
