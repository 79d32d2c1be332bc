import { DEFAULT_JWT_SECRET, loadConfig, parseShiftStarts, parseTrustProxy } from './configuration';

describe('loadConfig', () => {
  it('has safe development defaults: loopback, CORS closed', () => {
    const config = loadConfig({});
    expect(config.host).toBe('127.0.0.1');
    expect(config.port).toBe(3000);
    expect(config.corsOrigins).toEqual([]);
    expect(config.jwt.secret).toBe(DEFAULT_JWT_SECRET);
  });

  it('refuses the default secret in production', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/JWT_SECRET is still the development default/);
  });

  it('refuses a short secret in production and accepts a long one', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', JWT_SECRET: 'short' })).toThrow(/at least 32/);
    expect(loadConfig({ NODE_ENV: 'production', JWT_SECRET: 'x'.repeat(40) }).env).toBe('production');
  });

  it('names the variable that is malformed', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT must be a non-negative whole number/);
  });

  it('splits CORS origins', () => {
    expect(loadConfig({ CORS_ORIGINS: 'https://a.example, https://b.example' }).corsOrigins).toEqual([
      'https://a.example',
      'https://b.example',
    ]);
  });
});

describe('shift pattern', () => {
  it('validates the configured pattern', () => {
    expect(parseShiftStarts('14:00, 06:00,22:00')).toEqual(['06:00', '14:00', '22:00']);
    expect(() => parseShiftStarts('6am')).toThrow(/not HH:mm/);
    expect(() => parseShiftStarts('06:00,06:00')).toThrow(/repeats/);
  });
});

describe('TRUST_PROXY', () => {
  it('believes no proxy unless told to', () => {
    expect(loadConfig({}).trustProxy).toBe(false);
    expect(parseTrustProxy('false')).toBe(false);
  });

  it('takes a hop count or named proxies, and refuses "true" and nonsense', () => {
    expect(parseTrustProxy('1')).toBe(1);
    expect(parseTrustProxy('loopback, 10.0.0.0/8')).toBe('loopback,10.0.0.0/8');
    expect(() => parseTrustProxy('true')).toThrow(/would believe any X-Forwarded-For/);
    expect(() => parseTrustProxy('my proxy')).toThrow(/TRUST_PROXY has "my proxy"/);
  });
});
