import type { ScheduleRevisionDto } from '@morrowline/shared';
import { publicationMail } from './schedule-export';

const revision = (publishedAt: string): ScheduleRevisionDto => ({
  id: 7,
  zone: 'LANTERNSIDE',
  operatingDay: '2026-12-03',
  revision: 1,
  state: 'published',
  forecastRunId: 1,
  forecastIssuedAt: '2026-12-02T15:05:00.000Z',
  forecastReplayed: false,
  hours: [{ index: 0, hourEnding: 'HE01', intervalStartUtc: '2026-12-03T07:00:00.000Z', modelMw: 100, startMw: 100, adjustedMw: 100, lower80: null, upper80: null, lower95: null, upper95: null }],
  adjustments: [],
  createdBy: { id: 1, name: 'Ines' },
  createdAt: '2026-12-02T15:10:00.000Z',
  submittedBy: null,
  submittedAt: null,
  submitComment: null,
  late: false,
  returnedBy: null,
  returnedAt: null,
  returnComment: null,
  publishedBy: { id: 2, name: 'Nora Vance' },
  publishedAt,
  supersededAt: null,
  correctionReason: null,
  mail: null,
});

describe('the publication e-mail', () => {
  const publisher = { name: 'Nora Vance', email: 'nora@tallowmere.example' };
  const zone = { name: 'Lanternside', timeZone: 'America/Denver' };

  it("says when it was published in the zone's local time with its abbreviation, and UTC only labelled", () => {
    // 15:18 UTC on 2 December is 08:18 MST (UTC−7, America/Denver in winter)
    const { text } = publicationMail(revision('2026-12-02T15:18:42.341Z'), zone, publisher);
    expect(text).toContain('at 2026-12-02 08:18 MST (2026-12-02 15:18 UTC).');
    expect(text).not.toContain('2026-12-02T15:18');
  });

  it('writes a summer publication in daylight time', () => {
    const { text } = publicationMail(revision('2026-07-01T15:18:00.000Z'), zone, publisher);
    expect(text).toContain('at 2026-07-01 09:18 MDT (2026-07-01 15:18 UTC).');
  });
});
