import { describe, expect, it } from 'vitest';
import { gateCountdown } from './countdown';

const GATE = Date.parse('2026-05-12T16:00:00Z');
const MIN = 60_000;

describe('gateCountdown', () => {
  it('counts hours and minutes, rounding down, and is calm more than an hour out', () => {
    expect(gateCountdown(GATE, GATE - (5 * 60 + 12) * MIN - 30_000)).toEqual({ text: '5 h 12 min to gate closure', urgent: false, closed: false });
  });

  it('shows days for a day picked further ahead', () => {
    expect(gateCountdown(GATE, GATE - (2 * 24 * 60 + 3 * 60 + 5) * MIN).text).toBe('2 d 3 h 5 min to gate closure');
  });

  it('turns urgent at one hour left and counts minutes only', () => {
    expect(gateCountdown(GATE, GATE - 61 * MIN).urgent).toBe(false);
    expect(gateCountdown(GATE, GATE - 60 * MIN)).toEqual({ text: '1 h 0 min to gate closure', urgent: true, closed: false });
    expect(gateCountdown(GATE, GATE - 42 * MIN - 59_000)).toEqual({ text: '42 min to gate closure', urgent: true, closed: false });
  });

  it('never says 0 min while time is left', () => {
    expect(gateCountdown(GATE, GATE - 20_000).text).toBe('Under 1 min to gate closure');
  });

  it('says "Gate closed" at and after gate closure', () => {
    expect(gateCountdown(GATE, GATE)).toEqual({ text: 'Gate closed', urgent: false, closed: true });
    expect(gateCountdown(GATE, GATE + 3 * 60 * MIN).text).toBe('Gate closed');
  });
});
