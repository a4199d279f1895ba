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
