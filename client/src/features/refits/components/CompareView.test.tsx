import type { ModelCompareDto, ModelVersionDto, VersionIssueScoreDto } from '@morrowline/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { CompareView } from './CompareView';

function version(id: number, changes: Partial<ModelVersionDto> = {}): ModelVersionDto {
  return {
    id, zone: 'QUARRY', status: 'candidate', trigger: 'operator', differencing: [168], differencingLabel: '(1−B^168)', p: 2, q: 1, seasonal: null,
    coefficients: [{ name: 'ar1', value: 0.8123, se: 0.0211 }, { name: 'ma1', value: -0.3, se: null }], sigma2: 14.2, loglik: -3000, aic: 6008, aicc: 6008.1, bic: 6030,
    ljungBox: [{ lag: 24, statistic: 20, df: 21, pValue: 0.41 }, { lag: 48, statistic: 50, df: 45, pValue: 0.2 }], residualAcf: { lags: [], band: 0.05, outside: 1, maxAbs: 0.06 },
    trainingFrom: '', trainingTo: '', trainingHours: 1344, excludedHours: 6, backtestDays: 7, backtestOnForecastWeather: false, backtestMape: 3.1, baselineMape: 6.2, backtestCoverage80: 79.5, backtestCoverage95: 95.1, warnings: [],
    createdBy: 'ines.marlow@tallowmere.example', createdAt: '2026-07-14T15:00:00Z', durationMs: 900, jobId: 4, promotedAt: null, retiredAt: null, weather: null,
    ...changes,
  };
}

function score(versionId: number, mape: number): VersionIssueScoreDto {
  return {
    versionId, days: 1, hours: 24, mape, bias: -1.5, coverage80: 78, issuedDays: 0, inSampleDays: 0,
    perDay: [{ day: '2026-07-13', issuedAt: '2026-07-12T16:00:00Z', source: 're-forecast', hours: 24, mape }],
  };
}

function compare(candidateMape: number, inServiceMape: number, inService: Partial<ModelVersionDto> = {}, over: Partial<ModelCompareDto> = {}): ModelCompareDto {
  return {
    zone: 'QUARRY', timeZone: 'America/Denver', candidate: version(12), inService: version(9, { status: 'in-service', sigma2: 18.5, aicc: 6100.4, bic: 6120, ...inService }),
    sameDays: {
      days: 7, from: null, to: null, candidateMape, inServiceMape, baselineMape: 6.4, issueTime: 'at the 10:00 gate closure the day before',
      candidate: score(12, candidateMape), inService: score(9, inServiceMape), comparable: true, notComparable: null,
    },
    candidateBetter: candidateMape < inServiceMape,
    diagnostics: [],
    ...over,
  };
}

const cell = (id: string) => screen.getByTestId(id);

describe('CompareView', () => {
  it('marks the candidate better where it scores lower, with the seasonal-naive figure beside', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4)} />);
    expect(screen.getByTestId('compare-verdict')).toHaveTextContent('this version is better: 3.05 % against 4.40 %');
    expect(screen.getByTestId('compare-verdict')).toHaveTextContent('6.40 %');
    const mape = 'candidate-Backtest MAPE, same 7 days';
    expect(within(cell(mape)).getByText('better')).toBeInTheDocument();
    expect(within(cell('in-service-Backtest MAPE, same 7 days')).getByText('worse')).toBeInTheDocument();
    expect(within(cell('candidate-AICc')).getByText('better')).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Coefficients, Version 12' })).toHaveTextContent(/ar1\s*0\.8123\s*0\.0211/);
  });

  it('marks the candidate worse when the model in service scores lower on the same days', () => {
    renderWithProviders(<CompareView compare={compare(5.2, 4.4)} />);
    expect(screen.getByTestId('compare-verdict')).toHaveTextContent('this version is not better');
    expect(within(cell('candidate-Backtest MAPE, same 7 days')).getByText('worse')).toBeInTheDocument();
    expect(within(cell('in-service-Backtest MAPE, same 7 days')).getByText('better')).toBeInTheDocument();
  });

  it('prints the two same-day figures with decimals enough to tell them apart', () => {
    renderWithProviders(<CompareView compare={compare(3.6912, 3.6934)} />);
    expect(screen.getByTestId('compare-verdict')).toHaveTextContent('this version is better: 3.691 % against 3.693 % for the model in service');
    expect(cell('candidate-Backtest MAPE, same 7 days')).toHaveTextContent('3.691 %');
    expect(cell('in-service-Backtest MAPE, same 7 days')).toHaveTextContent('3.693 %');
  });

  it('names the seasonal block of a model that has one', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4, { p: 3, q: 1, seasonal: { P: 1, Q: 1, period: 24 } })} />);
    expect(screen.getByText('ARMA(3,1)×(1,1)_24 on (1−B^168)')).toBeTruthy();
  });
  it('does not rank criteria across different differencing', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4, { differencing: [24, 168], differencingLabel: '(1−B^24)(1−B^168)' })} />);
    expect(within(cell('candidate-AICc')).queryByText(/better|worse/)).toBeNull();
    expect(screen.getAllByText('not comparable: different differencing')).toHaveLength(2);
  });

  it('gives no badge when the two were not scored on the same days, and says why', () => {
    const notAlike = compare(3.05, 4.4, {}, { candidateBetter: null, sameDays: { ...compare(3.05, 4.4).sameDays, comparable: false, notComparable: 'not scored on the same days: version 12 could not forecast 2026-07-13' } });
    renderWithProviders(<CompareView compare={notAlike} />);
    expect(screen.getByTestId('compare-verdict')).toHaveTextContent('The two cannot be ranked: not scored on the same days: version 12 could not forecast 2026-07-13.');
    expect(within(cell('candidate-Backtest MAPE, same 7 days')).queryByText(/better|worse/)).toBeNull();
  });

  it('ranks no fit criterion between versions fitted on different hours, and never the Ljung–Box test', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4, { trainingFrom: '2026-05-01T00:00:00Z' })} />);
    expect(within(cell('candidate-AICc')).queryByText(/better|worse/)).toBeNull();
    expect(within(cell('candidate-σ² (MW²)')).queryByText(/better|worse/)).toBeNull();
    expect(screen.getAllByText('not comparable: fitted on different hours')).toHaveLength(2);
    expect(within(cell('candidate-Ljung–Box, lowest p')).queryByText(/better|worse/)).toBeNull();
  });

  it('shows each scored day with its issue time in the zone and what the scores mean', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4, {}, { diagnostics: ['Version 12: its 80 % band held only 55 % of the hours on these days, so the band is too narrow; keep a wider margin than it shows.'] })} />);
    expect(screen.getByTestId('scored-day-2026-07-13')).toHaveTextContent(/2026-07-13\s*2026-07-12 10:00 MDT\s*3\.05 %\s*4\.40 %/);
    expect(screen.getByTestId('compare-diagnostics')).toHaveTextContent('band is too narrow');
    expect(cell('candidate-80 % band held')).toHaveTextContent('78.00 %');
    expect(cell('candidate-Mean error')).toHaveTextContent('-1.5 MW');
  });

  it('sets with and without weather side by side: what each refit tried and which terms it kept', () => {
    const tried = (temperatureMape: number) => [
      { label: 'no weather or calendar terms', mape: 4.1 },
      { label: 'calendar', mape: 4.0 },
      { label: 'temperature (heating below 14 °C, cooling above 20 °C), calendar', mape: temperatureMape },
    ];
    const terms = { temperature: true, recency: false, calendar: true, heatBelow: 14, coolAbove: 20 };
    const withWeather = {
      used: true, description: '(1−B^168) ARMA(2,1) + temperature (heating below 14 °C, cooling above 20 °C), calendar', terms,
      response: [{ name: 'hdd_morning', value: 21.5, se: 1.2 }], candidates: tried(2.6), baselineMape: 6.2, selectionDays: 28, vintageIssuedAt: '2026-07-14T05:00:00Z',
    };
    const c = compare(3.05, 4.4, { weather: { ...withWeather, used: false, description: '(1−B^168) ARMA(2,1), no weather or calendar terms', response: [], candidates: tried(4.3) } });
    c.candidate = { ...c.candidate, weather: withWeather };
    renderWithProviders(<CompareView compare={c} />);
    expect(cell('compare-weather-candidate')).toHaveTextContent('Forecasts with the weather: (1−B^168) ARMA(2,1) + temperature');
    expect(cell('compare-weather-in-service')).toHaveTextContent('did not beat the model without them');
    const row = cell('weather-row-temperature (heating below 14 °C, cooling above 20 °C), calendar');
    // the calendar alone was tried too, and is not what either version kept
    expect(cell('weather-row-calendar')).not.toHaveTextContent('kept');
    expect(row).toHaveTextContent(/2\.60 %\s*kept\s*4\.30 %/);
    expect(cell('weather-row-no weather or calendar terms')).toHaveTextContent(/4\.10 %\s*4\.10 %\s*kept/);
  });

  it('shows no weather section when neither version had observed temperature', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4)} />);
    expect(screen.queryByTestId('compare-weather')).toBeNull();
  });
});
