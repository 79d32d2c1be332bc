import { repeatsVersion, type FitIdentity } from './unchanged-fit';

const fit = (overrides: Partial<FitIdentity> = {}): FitIdentity => ({
  differencing: [24, 168],
  p: 2,
  q: 1,
  coefficients: [
    { name: 'ar1', value: 0.61, se: 0.02 },
    { name: 'ar2', value: -0.12, se: 0.02 },
    { name: 'ma1', value: 0.3, se: 0.03 },
  ],
  sigma2: 14.2,
  trainingFrom: new Date('2026-10-01T06:00:00Z'),
  trainingTo: new Date('2026-12-02T15:00:00Z'),
  trainingHours: 1497,
  excludedHours: 6,
  ...overrides,
});

describe('an hourly update that changed nothing', () => {
  it('is recognised when the window and the estimates are those of the version in service', () => {
    expect(repeatsVersion(fit(), fit())).toBe(true);
  });

  it('is recognised when the refit from the stored coefficients moved only their last bits', () => {
    const c = fit().coefficients;
    expect(repeatsVersion(fit(), fit({ coefficients: [{ ...c[0], value: c[0].value * (1 + 4e-16) }, ...c.slice(1)], sigma2: fit().sigma2 * (1 + 1e-13) }))).toBe(true);
  });

  it('is a new version once a new hour of readings moves the window', () => {
    expect(repeatsVersion(fit(), fit({ trainingTo: new Date('2026-12-02T16:00:00Z'), trainingFrom: new Date('2026-10-01T07:00:00Z') }))).toBe(false);
  });

  it('is a new version when an outage window changes the hours left out', () => {
    expect(repeatsVersion(fit(), fit({ excludedHours: 9 }))).toBe(false);
  });

  it('is a new version when a corrected reading moves a coefficient or the variance, however little', () => {
    expect(repeatsVersion(fit(), fit({ coefficients: [{ name: 'ar1', value: 0.6100001, se: 0.02 }, ...fit().coefficients.slice(1)] }))).toBe(false);
    expect(repeatsVersion(fit(), fit({ sigma2: 14.21 }))).toBe(false);
  });

  it('is a new version when the orders differ', () => {
    expect(repeatsVersion(fit(), fit({ q: 2 }))).toBe(false);
    expect(repeatsVersion(fit(), fit({ differencing: [168] }))).toBe(false);
  });
});
