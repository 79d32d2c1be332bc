import { describe, expect, it } from 'vitest';
import { headerHasZone } from './csv-header';

describe('headerHasZone', () => {
  it('finds a zone column whatever its place, case or quoting', () => {
    expect(headerHasZone('timestamp,load_mw,zone')).toBe(true);
    expect(headerHasZone('\uFEFF"Zone","timestamp","load_mw"')).toBe(true);
  });
  it('says no for a file of timestamp and load only', () => {
    expect(headerHasZone('timestamp,load_mw')).toBe(false);
    expect(headerHasZone('2026-05-01T00:00:00Z,240.5')).toBe(false);
  });
});
