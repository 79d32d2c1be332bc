import { FIRST_YEAR, LAST_YEAR, parseDay, parseInstant } from './instant';

function ms(text: string): number {
  const result = parseInstant(text);
  if (!result.ok) throw new Error(result.message);
  return result.value;
}

function refusal(text: unknown, field?: string): string {
  const result = parseInstant(text, field);
  if (result.ok) throw new Error(`${String(text)} was accepted`);
  return result.message;
}

describe('parseInstant', () => {
  it('reads Z and ±hh:mm offsets to the same UTC instant', () => {
    // 2026-03-08T09:00Z is 1,772,960,400 s after the epoch (computed by hand: 20,520 days + 9 h).
    expect(ms('2026-03-08T09:00:00Z')).toBe(1_772_960_400_000);
    expect(ms('2026-03-08T02:00:00-07:00')).toBe(1_772_960_400_000);
    expect(ms('2026-03-08T14:30+05:30')).toBe(1_772_960_400_000);
    expect(ms('2026-03-08 09:00Z')).toBe(1_772_960_400_000);
    expect(ms('2026-03-08T09:00:00.250Z')).toBe(1_772_960_400_250);
  });

  it('accepts 29 February in a leap year only', () => {
    expect(ms('2024-02-29T00:00:00Z')).toBe(Date.UTC(2024, 1, 29));
    expect(refusal('2023-02-29T00:00:00Z')).toMatch(/not a real date: 2023-02 has no day 29/);
    expect(refusal('2100-02-29T00:00:00Z')).toMatch(/not a real date/);
  });

  it.each([
    ['2023-02-30T00:00:00Z', /no day 30/],
    ['2023-04-31T00:00:00Z', /no day 31/],
    ['2023-13-01T00:00:00Z', /no month 13/],
    ['2023-00-10T00:00:00Z', /no month 0/],
    ['2024-02-29T24:00:00Z', /hour 24: hours run 00 to 23/],
    ['2024-02-28T10:60:00Z', /minute 60/],
    ['2024-02-28T10:00:60Z', /second 60/],
    ['2024-02-28T10:00:00+15:00', /beyond ±14:00/],
    ['2024-02-28T10:00:00+01:75', /offset with minute 75/],
  ])('refuses the impossible %s instead of rolling it over', (text, message) => {
    expect(refusal(text, 'hour')).toMatch(message);
    expect(refusal(text, 'hour')).toMatch(/^hour /);
  });

  it.each(['2024-02-28T10:00:00', '2024-02-28T10:00', '2024-02-28 10:00:00.5'])('refuses %j, saying the offset is missing', (text) => {
    expect(refusal(text, 'start')).toBe(`start ${JSON.stringify(text)} has no offset: add Z or ±hh:mm (without one it would be read in whatever time zone the reader runs in)`);
  });

  it.each(['2024-02-28', '2024-02-28T10:00:00+0100', '2024-02-28T10Z', ' 2024-02-28T10:00Z', '2024-02-28T10:00Z ', '+002024-02-28T10:00Z', '1709114400000', 'yesterday', ''])(
    'refuses %j: not ISO 8601 date and time',
    (text) => {
      expect(refusal(text, 'from')).toBe('from must be an ISO 8601 date and time');
    },
  );

  it('refuses what is not text', () => {
    for (const value of [null, undefined, 1709114400000, {}, ['2024-02-28T10:00Z']]) expect(refusal(value, 'start')).toBe('start must be an ISO 8601 date and time with an offset, e.g. 2026-03-08T09:00:00Z');
  });

  it(`keeps to the window, UTC years ${FIRST_YEAR} to ${LAST_YEAR}`, () => {
    expect(FIRST_YEAR).toBe(2000);
    expect(LAST_YEAR).toBe(2100);
    expect(ms('2000-01-01T00:00:00Z')).toBe(946_684_800_000);
    expect(ms('2100-12-31T23:59:59Z')).toBe(4_133_980_799_000);
    for (const text of ['0000-01-01T00:00:00Z', '1000-06-01T00:00:00Z', '1999-12-31T23:59:59Z', '2101-01-01T00:00:00Z', '9999-12-31T00:00:00Z', '2000-01-01T00:30:00+01:00']) {
      expect(refusal(text)).toMatch(/outside the accepted years 2000 to 2100/);
    }
  });

  it('cuts a long hostile string short in its message', () => {
    const message = refusal(`2024${'x'.repeat(5000)}`);
    expect(message.length).toBeLessThan(200);
  });
});

describe('parseDay', () => {
  it('accepts a real date in the window and answers it unchanged', () => {
    expect(parseDay('2024-02-29')).toEqual({ ok: true, value: '2024-02-29' });
    expect(parseDay('2000-01-01')).toEqual({ ok: true, value: '2000-01-01' });
    expect(parseDay('2100-12-31')).toEqual({ ok: true, value: '2100-12-31' });
  });

  it.each([
    ['2023-02-29', /no day 29/],
    ['2023-02-30', /no day 30/],
    ['2023-13-01', /no month 13/],
    ['0000-01-01', /outside the accepted years 2000 to 2100/],
    ['9999-12-31', /outside the accepted years 2000 to 2100/],
    ['1999-12-31', /outside/],
    ['2024-2-1', /"2024-2-1" is not in that form/],
    ['2024-02-01T00:00Z', /is not in that form/],
    [' 2024-02-01', /is not in that form/],
  ])('refuses %s', (text, message) => {
    const result = parseDay(text, 'from');
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.message).toMatch(/^from must be an operating day, YYYY-MM-DD: /);
    if (!result.ok) expect(result.message).toMatch(message);
  });
});
