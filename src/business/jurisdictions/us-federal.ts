/**
 * United States federal holidays, as data.
 *
 * @module
 */
import { type CalendarDefinition, HOLIDAY_CAUTION } from '../definition.js';
import { deepFreezeDefinition } from './freeze.js';

/**
 * The legal public holidays of 5 U.S.C. 6103(a) with the weekend observance of 5 U.S.C. 6103(b) and Executive
 * Order 11582, section 3(a), for employees with a Monday-to-Friday workweek: a holiday on a Saturday is observed
 * on the Friday before (1 January on a Saturday is observed on 31 December of the year before), one on a Sunday on
 * the Monday after. From 1971, the first year of the Monday holidays of Pub. L. 90-363.
 */
export const US_FEDERAL_HOLIDAYS: CalendarDefinition = deepFreezeDefinition({
  id: 'us-federal',
  name: 'United States federal holidays',
  source:
    '5 U.S.C. 6103(a) (legal public holidays) as amended by Pub. L. 90-363 (Monday holidays, from 1971), Pub. L. 94-97 ' +
    '(Veterans Day on 11 November again from 1978), Pub. L. 98-144 (Birthday of Martin Luther King, Jr., from 1986) and ' +
    'Pub. L. 117-17 (Juneteenth National Independence Day, from 2021); observance by 5 U.S.C. 6103(b) and Executive ' +
    'Order 11582 section 3(a) (Saturday -> preceding Friday, Sunday -> following Monday), as in the federal holiday ' +
    'tables of the U.S. Office of Personnel Management.',
  caution:
    `${HOLIDAY_CAUTION} Not included: Inauguration Day (a holiday only for employees in the Washington, D.C., area, ` +
    '5 U.S.C. 6103(c)) and closures of federal offices by executive order (for example an extra day at Christmas or a ' +
    'national day of mourning); add them as additions. Banks, exchanges and states keep their own calendars.',
  weekend: ['saturday', 'sunday'],
  observance: { saturday: 'previous-non-weekend-day', sunday: 'next-non-weekend-day' },
  years: { from: 1971 },
  holidays: [
    { id: 'new-years-day', name: "New Year's Day", kind: 'fixed', month: 1, day: 1 },
    {
      id: 'birthday-of-martin-luther-king-jr',
      name: 'Birthday of Martin Luther King, Jr.',
      kind: 'nth-weekday',
      month: 1,
      weekday: 'monday',
      nth: 3,
      from: 1986,
      source: 'Pub. L. 98-144',
    },
    { id: 'washingtons-birthday', name: "Washington's Birthday", kind: 'nth-weekday', month: 2, weekday: 'monday', nth: 3 },
    { id: 'memorial-day', name: 'Memorial Day', kind: 'nth-weekday', month: 5, weekday: 'monday', nth: 'last' },
    {
      id: 'juneteenth',
      name: 'Juneteenth National Independence Day',
      kind: 'fixed',
      month: 6,
      day: 19,
      from: 2021,
      source: 'Pub. L. 117-17',
    },
    { id: 'independence-day', name: 'Independence Day', kind: 'fixed', month: 7, day: 4 },
    { id: 'labor-day', name: 'Labor Day', kind: 'nth-weekday', month: 9, weekday: 'monday', nth: 1 },
    { id: 'columbus-day', name: 'Columbus Day', kind: 'nth-weekday', month: 10, weekday: 'monday', nth: 2 },
    {
      id: 'veterans-day-october',
      name: 'Veterans Day',
      kind: 'nth-weekday',
      month: 10,
      weekday: 'monday',
      nth: 4,
      until: 1977,
      source: 'Pub. L. 90-363',
    },
    { id: 'veterans-day', name: 'Veterans Day', kind: 'fixed', month: 11, day: 11, from: 1978, source: 'Pub. L. 94-97' },
    { id: 'thanksgiving-day', name: 'Thanksgiving Day', kind: 'nth-weekday', month: 11, weekday: 'thursday', nth: 4 },
    { id: 'christmas-day', name: 'Christmas Day', kind: 'fixed', month: 12, day: 25 },
  ],
});
