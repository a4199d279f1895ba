/**
 * The demo's invented scenario. Otterbrook Tea & Spice Co. is a company we made up: a wholesaler and retailer
 * of tea and spices with offices in three zones. Every name and figure here is invented for the demo; none
 * describes a real business or person.
 */
import { seededRandom } from '../bench/harness.js';

/** The company's name, as printed by the demo. */
export const COMPANY = 'Otterbrook Tea & Spice Co. (an invented company)';

/** The company's offices, each with the IANA zone of its wall clock. */
export const OFFICES = [
  { name: 'Head office and warehouse', city: 'Chicago', zone: 'America/Chicago' },
  { name: 'European sales desk', city: 'Dublin', zone: 'Europe/Dublin' },
  { name: 'Sourcing office', city: 'Kolkata', zone: 'Asia/Kolkata' },
  { name: 'Pacific sales desk', city: 'Auckland', zone: 'Pacific/Auckland' },
] as const;

/** The zone the company books its results in. */
export const BOOKING_ZONE = 'America/Chicago';

/** One invented sale: when it happened (epoch ms), which shop, and its amount in dollars. */
export interface Sale {
  readonly epochMs: number;
  readonly shop: string;
  readonly amount: number;
}

const SHOPS = ['Lakeside', 'Old Mill', 'Harbour Row'] as const;

/**
 * Invented sales from `startMs` for `days` days: a seeded random stream with a weekly rhythm (busier Saturdays)
 * and a December peak, so that charts have a shape. Deterministic: the same arguments give the same sales.
 */
export function inventedSales(startMs: number, days: number, seed = 20240): Sale[] {
  const rnd = seededRandom(seed);
  const sales: Sale[] = [];
  for (let d = 0; d < days; d++) {
    const dayStart = startMs + d * 86_400_000;
    const weekday = (Math.floor(dayStart / 86_400_000) + 3) % 7; // 0 = Monday in UTC terms
    const month = new Date(dayStart).getUTCMonth();
    const base = weekday === 5 ? 34 : weekday === 6 ? 12 : 20;
    const count = Math.round(base * (month === 11 ? 1.6 : 1) * (0.8 + 0.4 * rnd()));
    for (let k = 0; k < count; k++) {
      const at = dayStart + Math.floor((8 + 11 * rnd()) * 3_600_000);
      sales.push({ epochMs: at, shop: SHOPS[Math.floor(rnd() * SHOPS.length)]!, amount: Math.round(500 + 4000 * rnd()) / 100 });
    }
  }
  sales.sort((a, b) => a.epochMs - b.epochMs);
  return sales;
}

// ---- Business time (the hours layer) -------------------------------------------------------------------------

import type { CalendarDefinition, HoursDefinition } from '../src/index.js';

const DESK_DAY = [{ open: '08:00', close: '18:00' }];

/**
 * The company's support desk in Chicago: weekdays 08:00-18:00 on the United States federal holidays, closing early
 * the business day before Thanksgiving (15:00) and on the business day before Christmas Day (12:00). Its promise
 * (invented): every ticket answered within 8 business hours.
 */
export const SUPPORT_DESK_HOURS: HoursDefinition = {
  id: 'otterbrook-support-desk',
  name: 'Otterbrook support desk (invented)',
  zone: 'America/Chicago',
  calendar: 'us-federal',
  week: { monday: DESK_DAY, tuesday: DESK_DAY, wednesday: DESK_DAY, thursday: DESK_DAY, friday: DESK_DAY },
  special: [
    { holiday: 'Thanksgiving Day', offset: -1, close: '15:00', name: 'Thanksgiving eve: early close' },
    { holiday: 'Christmas Day', offset: -1, close: '12:00', name: 'Christmas Eve: early close' },
  ],
};

/** The desk's answer target, in business ms. */
export const SUPPORT_TARGET_MS = 8 * 3_600_000;

/**
 * The company's payments office in Chicago (invented): weekdays 08:00-18:00 on the United States federal holidays,
 * with a 17:00 cut-off for payments (12:00 on the early close before Christmas Day, when the office shuts at 13:00).
 */
export const PAYMENTS_OFFICE_HOURS: HoursDefinition = {
  id: 'otterbrook-payments',
  name: 'Otterbrook payments office (invented)',
  zone: 'America/Chicago',
  calendar: 'us-federal',
  week: { monday: DESK_DAY, tuesday: DESK_DAY, wednesday: DESK_DAY, thursday: DESK_DAY, friday: DESK_DAY },
  special: [{ holiday: 'Christmas Day', offset: -1, close: '13:00', cutoffs: { payments: '12:00' } }],
  cutoffs: { payments: '17:00' },
};

/** The warehouse's own closing days (invented): Sundays, and four holidays on their dates. */
export const WAREHOUSE_CLOSING_DAYS: CalendarDefinition = {
  id: 'otterbrook-warehouse',
  name: 'Otterbrook warehouse closing days (invented)',
  weekend: ['sunday'],
  holidays: [
    { id: 'new-year', name: "New Year's Day", kind: 'fixed', month: 1, day: 1 },
    { id: 'independence', name: 'Independence Day', kind: 'fixed', month: 7, day: 4 },
    { id: 'thanksgiving', name: 'Thanksgiving Day', kind: 'nth-weekday', month: 11, weekday: 'thursday', nth: 4 },
    { id: 'christmas', name: 'Christmas Day', kind: 'fixed', month: 12, day: 25 },
  ],
};

const DAY_SHIFT = [{ open: '07:00', close: '15:00' }];
const DAY_AND_NIGHT = [{ open: '07:00', close: '15:00' }, { open: '22:00', close: '06:00' }];

/**
 * The warehouse in Chicago (invented): a day shift 07:00-15:00 Monday to Saturday and a night shift 22:00-06:00 on
 * Thursday, Friday and Saturday nights (each night belongs to the day it starts). On Friday 2025-10-31 it closes at
 * 12:00 for a stocktake, so that night has no shift.
 */
export const WAREHOUSE_HOURS: HoursDefinition = {
  id: 'otterbrook-warehouse',
  name: 'Otterbrook warehouse shifts (invented)',
  zone: 'America/Chicago',
  calendar: WAREHOUSE_CLOSING_DAYS,
  week: { monday: DAY_SHIFT, tuesday: DAY_SHIFT, wednesday: DAY_SHIFT, thursday: DAY_AND_NIGHT, friday: DAY_AND_NIGHT, saturday: DAY_AND_NIGHT },
  special: [{ date: '2025-10-31', close: '12:00', name: 'Stocktake: early close' }],
};

/**
 * Invented support tickets: `count` open times spread over [startMs, startMs + days), most in the desk's daytime
 * (Chicago is 5 or 6 hours behind UTC), each answered after a delay of minutes to a few days. Deterministic.
 */
export function inventedTickets(count: number, startMs: number, days: number, seed = 16016): { opened: Float64Array; answered: Float64Array } {
  const rnd = seededRandom(seed);
  const opened = new Float64Array(count);
  const answered = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const day = Math.floor(rnd() * days);
    const hourUtc = rnd() < 0.8 ? 13 + rnd() * 11 : rnd() * 24;
    opened[i] = startMs + day * 86_400_000 + Math.floor(hourUtc * 3_600_000);
    const quick = rnd() < 0.7;
    answered[i] = opened[i]! + Math.floor((quick ? rnd() * 6 : rnd() * 72) * 3_600_000);
  }
  return { opened, answered };
}
