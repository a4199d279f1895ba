/**
 * Bank holidays in England and Wales, as data.
 *
 * @module
 */
import { type CalendarDefinition, HOLIDAY_CAUTION } from '../definition.js';
import { deepFreezeDefinition } from './freeze.js';

const SUBSTITUTE = { saturday: 'substitute-day', sunday: 'substitute-day' } as const;

/**
 * Bank holidays in England and Wales: the Banking and Financial Dealings Act 1971, section 1 and Schedule 1
 * (Easter Monday, the last Monday in May, the last Monday in August, 26 December, and 27 December when 25 or 26
 * December is a Sunday); New Year's Day and the early May bank holiday appointed by Royal Proclamation under
 * section 1(3); Good Friday and Christmas Day as common-law holidays; substitute days (the next weekday that is not
 * already a bank holiday) for holidays on a weekend, as proclaimed; and the one-off changes made by Royal
 * Proclamation. From 1995.
 */
export const ENGLAND_AND_WALES_BANK_HOLIDAYS: CalendarDefinition = deepFreezeDefinition({
  id: 'england-and-wales',
  name: 'Bank holidays in England and Wales',
  source:
    'Banking and Financial Dealings Act 1971, section 1 and Schedule 1; Royal Proclamations under section 1(3) for ' +
    "New Year's Day, the early May bank holiday, substitute days and one-off changes (1995, 1999, 2002, 2011, 2012, " +
    '2020, 2022, 2023); Good Friday and Christmas Day as common-law holidays; as published by the UK government at ' +
    'gov.uk/bank-holidays.',
  caution:
    `${HOLIDAY_CAUTION} Scotland and Northern Ireland have different bank holidays. Extra or moved bank holidays are ` +
    'proclaimed for royal and national occasions, often less than a year ahead; the one-off changes before 2012 here ' +
    'are recorded from memory and must be checked against the proclamations.',
  weekend: ['saturday', 'sunday'],
  years: { from: 1995 },
  holidays: [
    { id: 'new-years-day', name: "New Year's Day", kind: 'fixed', month: 1, day: 1, observance: SUBSTITUTE },
    { id: 'good-friday', name: 'Good Friday', kind: 'easter', offset: -2 },
    { id: 'easter-monday', name: 'Easter Monday', kind: 'easter', offset: 1 },
    { id: 'early-may', name: 'Early May bank holiday', kind: 'nth-weekday', month: 5, weekday: 'monday', nth: 1, from: 1978 },
    { id: 'spring', name: 'Spring bank holiday', kind: 'nth-weekday', month: 5, weekday: 'monday', nth: 'last' },
    { id: 'summer', name: 'Summer bank holiday', kind: 'nth-weekday', month: 8, weekday: 'monday', nth: 'last' },
    { id: 'christmas-day', name: 'Christmas Day', kind: 'fixed', month: 12, day: 25, observance: SUBSTITUTE },
    { id: 'boxing-day', name: 'Boxing Day', kind: 'fixed', month: 12, day: 26, observance: SUBSTITUTE },
  ],
  removals: [
    { date: '1995-05-01', name: 'Early May bank holiday moved to 8 May 1995 (VE Day anniversary)' },
    { date: '2002-05-27', name: 'Spring bank holiday moved to 4 June 2002 (Golden Jubilee)' },
    { date: '2012-05-28', name: 'Spring bank holiday moved to 4 June 2012 (Diamond Jubilee)' },
    { date: '2020-05-04', name: 'Early May bank holiday moved to 8 May 2020 (VE Day anniversary)' },
    { date: '2022-05-30', name: 'Spring bank holiday moved to 2 June 2022 (Platinum Jubilee)' },
  ],
  additions: [
    { date: '1995-05-08', name: 'Early May bank holiday (VE Day)' },
    { date: '1999-12-31', name: 'Millennium bank holiday' },
    { date: '2002-06-03', name: 'Golden Jubilee bank holiday' },
    { date: '2002-06-04', name: 'Spring bank holiday' },
    { date: '2011-04-29', name: 'Royal wedding bank holiday' },
    { date: '2012-06-04', name: 'Spring bank holiday' },
    { date: '2012-06-05', name: 'Diamond Jubilee bank holiday' },
    { date: '2020-05-08', name: 'Early May bank holiday (VE day)' },
    { date: '2022-06-02', name: 'Spring bank holiday' },
    { date: '2022-06-03', name: 'Platinum Jubilee bank holiday' },
    { date: '2022-09-19', name: 'Bank Holiday for the State Funeral of Queen Elizabeth II' },
    { date: '2023-05-08', name: 'Bank holiday for the coronation of King Charles III' },
  ],
});
