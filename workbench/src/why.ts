/**
 * Why a rule's date moved, in words. The recurrence layer is gaining an API that explains each adjustment; until
 * it lands, this one function works it out from the calendar alone (isBusinessDay, listHolidays and
 * adjustDayNumber), so that swapping it for the library's answer touches nothing else: it takes the calendar, the
 * rule's date, the adjusted date and the convention, and returns one sentence.
 */
import { type BusinessCalendar, type BusinessDayConvention, adjustDayNumber, formatPlainDate, isBusinessDay, listHolidays, weekdayOfDayNumber } from 'kalends';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

const CONVENTION_WORDS: Readonly<Record<string, string>> = {
  following: 'following: the next business day',
  preceding: 'preceding: the previous business day',
  'modified-following': 'modified following: the next business day in the same month',
  'modified-preceding': 'modified preceding: the previous business day in the same month',
};

/** Why day `d` is closed: its holidays by name, and the weekend. */
function closedBecause(calendar: BusinessCalendar, d: number): string {
  const reasons = listHolidays(calendar, d, d + 1).map((h) => `a holiday, ${h.name}`);
  if (calendar.weekend.includes(weekdayOfDayNumber(d))) reasons.push('a weekend day');
  return reasons.join(' and ') || 'a closing day';
}

function day(d: number): string {
  return `${WEEKDAYS[weekdayOfDayNumber(d) - 1]} ${formatPlainDate(d)}`;
}

/**
 * One sentence on why `unadjusted` became `adjusted` under `convention` on `calendar`; the empty string when it
 * did not move.
 */
export function whyItMoved(calendar: BusinessCalendar, unadjusted: number, adjusted: number, convention: BusinessDayConvention): string {
  if (adjusted === unadjusted) return '';
  const parts = [`${day(unadjusted)} is ${closedBecause(calendar, unadjusted)}.`];
  // The other closed days it passed over on its way.
  const step = adjusted > unadjusted ? 1 : -1;
  const passed: string[] = [];
  for (let d = unadjusted + step; d !== adjusted && passed.length < 10; d += step) {
    if (!isBusinessDay(calendar, d)) passed.push(`${day(d)} is ${closedBecause(calendar, d)}`);
  }
  if (passed.length > 0) parts.push(`${passed.join('; ')}.`);
  const rule = CONVENTION_WORDS[convention] ?? convention;
  if (convention === 'modified-following' && adjusted < unadjusted) {
    parts.push(`The next business day, ${day(adjustDayNumber(calendar, unadjusted, 'following'))}, is in the next month, so ${rule} moves it back to ${day(adjusted)}.`);
  } else if (convention === 'modified-preceding' && adjusted > unadjusted) {
    parts.push(`The previous business day, ${day(adjustDayNumber(calendar, unadjusted, 'preceding'))}, is in the previous month, so ${rule} moves it on to ${day(adjusted)}.`);
  } else parts.push(`By ${rule}, ${day(adjusted)}.`);
  return parts.join(' ');
}
