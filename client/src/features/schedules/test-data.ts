import { operatingDayHours, type ScheduleHourDto, type ScheduleRevisionDto, type ScheduleState, type ZoneScheduleDto } from '@morrowline/shared';

const TZ = 'America/Denver';

/** The day's hours as the server sends them, using the desk's own hour-ending helper for the labels. */
export function hoursOf(day: string, model: (index: number) => number | null = (i) => 150 + i, adjust: (index: number, mw: number) => number = (_i, mw) => mw): ScheduleHourDto[] {
  return operatingDayHours(day, TZ).map((h, index) => {
    const mw = model(index);
    return {
      index,
      intervalStartUtc: h.hourStart,
      hourEnding: h.label,
      modelMw: mw,
      lower80: mw === null ? null : mw - 10,
      upper80: mw === null ? null : mw + 10,
      lower95: mw === null ? null : mw - 20,
      upper95: mw === null ? null : mw + 20,
      startMw: mw,
      adjustedMw: mw === null ? null : adjust(index, mw),
    };
  });
}

export function revisionFixture(zone: string, day: string, state: ScheduleState, overrides: Partial<ScheduleRevisionDto> = {}): ScheduleRevisionDto {
  return {
    id: 7,
    zone,
    operatingDay: day,
    revision: 1,
    state,
    forecastRunId: 3,
    forecastIssuedAt: '2026-05-11T12:00:00.000Z',
    forecastReplayed: false,
    hours: hoursOf(day),
    adjustments: [],
    createdBy: { id: 2, name: 'Ines Marlow' },
    createdAt: '2026-05-11T14:00:00.000Z',
    submittedBy: null,
    submittedAt: null,
    submitComment: null,
    late: false,
    returnedBy: null,
    returnedAt: null,
    returnComment: null,
    publishedBy: null,
    publishedAt: null,
    supersededAt: null,
    correctionReason: null,
    mail: null,
    ...overrides,
  };
}

export function zoneFixture(zone: string, day: string, overrides: Partial<ZoneScheduleDto> = {}): ZoneScheduleDto {
  const hours = hoursOf(day);
  return {
    zone,
    zoneName: zone === 'MILLRACE' ? 'Millrace' : zone === 'HARROW' ? 'Harrow Flats' : zone,
    timeZone: TZ,
    operatingDay: day,
    slots: hours.map(({ index, intervalStartUtc, hourEnding }) => ({ index, intervalStartUtc, hourEnding })),
    gateClosureAt: '2099-05-11T16:00:00.000Z',
    secondsToGateClosure: 3600 * 5,
    gateClosed: false,
    forecast: { runId: 3, issuedAt: '2026-05-11T12:00:00.000Z', hours },
    newerForecast: null,
    working: null,
    published: null,
    ...overrides,
  };
}
