import type { ScheduleAdjustmentKind } from '@morrowline/shared';

/**
 * The demo scenario's published schedules (Tallowmere Valley Electric Cooperative, invented):
 * the last three operating days, on which operators published each zone's schedule, adjusting the
 * model forecast for a reason of their own on some, and a supervisor approved. Times are minutes
 * after the day's forecast update, all before the gate closure. Some adjustments follow what the load then did (the weather desk and the mill were
 * right), some need not (the smelter came back sooner than its control room said; the night market
 * drew what it drew), so the Accuracy screen's "did the adjustments help" has both kinds of day.
 */

/** A fixed change, or one that moves `share` of the way from the model to what the load did. */
export type DemoChange = { kind: 'add'; mw: number } | { kind: 'add' | 'scale'; toward: number };

export interface DemoAdjustment {
  minute: number;
  /** Hour-ending labels, both included. */
  from: string;
  to: string;
  change: DemoChange;
  /** The operator's reason; `up` says whether the change raises the hours. */
  reason: (up: boolean, month: number) => string;
}

export interface DemoScheduleStory {
  zone: string;
  /** The operating day: this many days before today (desk time). */
  daysAgo: number;
  operator: string;
  approver: string;
  draftMinute: number;
  adjustments: DemoAdjustment[];
  submit: { minute: number; comment: string };
  approveMinute: number;
}

const INES = 'ines.marlow@tallowmere.example';
const TOMAS = 'tomas.reedy@tallowmere.example';
const HAL = 'hal.brennick@tallowmere.example';
const NORA = 'nora.vance@tallowmere.example';

const heatingSeason = (month: number) => month <= 4 || month >= 10;

/** The weather desk's word on a part of the day, in the season's terms. */
function weather(part: string, heating: string, cooling: string): DemoAdjustment['reason'] {
  return (up, month) =>
    heatingSeason(month)
      ? `Weather desk: ${part} ${up ? 'colder' : 'milder'} than the model's weather (${up ? 'about 3 °C below' : 'about 3 °C above'}); ${up ? 'more' : 'less'} ${heating}`
      : `Weather desk: ${part} ${up ? 'hotter' : 'cooler'} than the model's weather (${up ? 'about 3 °C above' : 'about 3 °C below'}); ${up ? 'more' : 'less'} ${cooling}`;
}

/** The zone's schedule published as the model gave it: most days, the forecast stands. */
function asTheModel(zone: string, daysAgo: number, operator: string, approver: string, minute: number): DemoScheduleStory {
  return { zone, daysAgo, operator, approver, draftMinute: minute, adjustments: [], submit: { minute: minute + 6, comment: 'Model forecast as issued; nothing to add.' }, approveMinute: minute + 18 };
}

/**
 * Three operating days, every zone published on each (so the system total compares too), six of
 * the fifteen with an operator's adjustment.
 */
export const DEMO_SCHEDULE_STORIES: readonly DemoScheduleStory[] = [
  // three days ago: a weather correction in Millrace
  {
    zone: 'MILLRACE',
    daysAgo: 3,
    operator: INES,
    approver: HAL,
    draftMinute: 8,
    adjustments: [{ minute: 14, from: 'HE17', to: 'HE22', change: { kind: 'add', toward: 0.8 }, reason: weather('the evening', 'electric heating in the old houses', 'air-conditioning in the flats') }],
    submit: { minute: 22, comment: 'Evening weather correction; the rest as the model.' },
    approveMinute: 37,
  },
  asTheModel('COPPERLINE', 3, TOMAS, NORA, 6),
  asTheModel('HARROW', 3, INES, HAL, 10),
  asTheModel('LANTERN', 3, TOMAS, NORA, 12),
  asTheModel('QUARRY', 3, INES, NORA, 15),
  // two days ago: the smelter's potline trip, and Harrow's weather
  {
    zone: 'COPPERLINE',
    daysAgo: 2,
    operator: TOMAS,
    approver: NORA,
    draftMinute: 6,
    adjustments: [
      {
        minute: 12,
        from: 'HE08',
        to: 'HE15',
        change: { kind: 'add', mw: -32 },
        reason: () => "Smelter control room: potline 2 tripped at 06:40 today; restart not expected before tomorrow's evening shift",
      },
    ],
    submit: { minute: 19, comment: 'Potline trip as the plant reported it at 07:05.' },
    approveMinute: 31,
  },
  {
    zone: 'HARROW',
    daysAgo: 2,
    operator: INES,
    approver: HAL,
    draftMinute: 10,
    adjustments: [
      { minute: 17, from: 'HE15', to: 'HE21', change: { kind: 'scale', toward: 0.7 }, reason: weather('the afternoon and evening', 'heating in the suburbs', 'air-conditioning in the suburbs') },
      { minute: 21, from: 'HE06', to: 'HE09', change: { kind: 'add', toward: 0.5 }, reason: weather('the morning', 'heating as households wake', 'pre-cooling before the heat') },
    ],
    submit: { minute: 28, comment: 'Weather corrections from the 08:30 weather briefing.' },
    approveMinute: 44,
  },
  asTheModel('MILLRACE', 2, INES, HAL, 8),
  asTheModel('LANTERN', 2, TOMAS, NORA, 11),
  asTheModel('QUARRY', 2, TOMAS, HAL, 14),
  // yesterday: the Lanternside night market, and the feed mill at Quarry Hill
  {
    zone: 'LANTERN',
    daysAgo: 1,
    operator: TOMAS,
    approver: NORA,
    draftMinute: 9,
    adjustments: [
      {
        minute: 15,
        from: 'HE18',
        to: 'HE22',
        change: { kind: 'add', mw: 9 },
        reason: () => 'Lanternside night market on the square (town events office): shops open until 22:00, stalls and street lighting',
      },
    ],
    submit: { minute: 24, comment: 'Night market load per the events office.' },
    approveMinute: 40,
  },
  {
    zone: 'QUARRY',
    daysAgo: 1,
    operator: INES,
    approver: HAL,
    draftMinute: 7,
    adjustments: [
      {
        minute: 13,
        from: 'HE07',
        to: 'HE16',
        change: { kind: 'add', toward: 0.7 },
        reason: (up) => (up ? 'Feed mill at Quarry Hill running a second shift this week (the mill called at 08:15)' : 'Feed mill at Quarry Hill down for maintenance until the evening (the mill called at 08:15)'),
      },
    ],
    submit: { minute: 20, comment: 'Feed mill per its call.' },
    approveMinute: 33,
  },
  asTheModel('MILLRACE', 1, INES, NORA, 9),
  asTheModel('COPPERLINE', 1, TOMAS, HAL, 11),
  asTheModel('HARROW', 1, TOMAS, HAL, 13),
];

/**
 * The value of an adjustment on its hours: fixed, or `toward` of the mean gap between the model
 * and the actual load on those hours (MW for add, percent for scale). Null when no hour has both.
 */
export function adjustmentValue(change: DemoChange, model: readonly (number | null)[], actual: readonly (number | null)[]): { kind: ScheduleAdjustmentKind; value: number } | null {
  if ('mw' in change) return { kind: 'add', value: change.mw };
  let gap = 0;
  let n = 0;
  for (let i = 0; i < model.length; i++) {
    const m = model[i];
    const a = actual[i];
    if (m === null || a === null || !(m > 0)) continue;
    gap += change.kind === 'add' ? a - m : a / m - 1;
    n++;
  }
  if (n === 0) return null;
  if (change.kind === 'add') {
    const mw = Math.round(change.toward * (gap / n));
    return { kind: 'add', value: mw === 0 ? 1 : mw };
  }
  const pct = Math.round(change.toward * 1000 * (gap / n)) / 10;
  return { kind: 'scale', value: pct === 0 ? 0.5 : pct };
}
