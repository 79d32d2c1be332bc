import type { ModelCompareDto, ModelVersionDto } from '@morrowline/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { CompareView } from './CompareView';

function version(id: number, changes: Partial<ModelVersionDto> = {}): ModelVersionDto {
  return {
    id, zone: 'QUARRY', status: 'candidate', trigger: 'operator', differencing: [168], differencingLabel: '(1−B^168)', p: 2, q: 1,
    coefficients: [{ name: 'ar1', value: 0.8123, se: 0.0211 }, { name: 'ma1', value: -0.3, se: null }], sigma2: 14.2, loglik: -3000, aic: 6008, aicc: 6008.1, bic: 6030,
    ljungBox: [{ lag: 24, statistic: 20, df: 21, pValue: 0.41 }, { lag: 48, statistic: 50, df: 45, pValue: 0.2 }], residualAcf: { lags: [], band: 0.05, outside: 1, maxAbs: 0.06 },
    trainingFrom: '', trainingTo: '', trainingHours: 1344, excludedHours: 6, backtestDays: 7, backtestMape: 3.1, baselineMape: 6.2, warnings: [],
    createdBy: 'ines.marlow@tallowmere.example', createdAt: '2026-07-14T15:00:00Z', durationMs: 900, jobId: 4, promotedAt: null, retiredAt: null,
    ...changes,
  };
}

function compare(candidateMape: number, inServiceMape: number, inService: Partial<ModelVersionDto> = {}): ModelCompareDto {
  return {
    zone: 'QUARRY', candidate: version(12), inService: version(9, { status: 'in-service', sigma2: 18.5, aicc: 6100.4, bic: 6120, ...inService }),
    sameDays: { days: 7, from: null, to: null, candidateMape, inServiceMape, baselineMape: 6.4 }, candidateBetter: candidateMape < inServiceMape,
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

  it('does not rank criteria across different differencing', () => {
    renderWithProviders(<CompareView compare={compare(3.05, 4.4, { differencing: [24, 168], differencingLabel: '(1−B^24)(1−B^168)' })} />);
    expect(within(cell('candidate-AICc')).queryByText(/better|worse/)).toBeNull();
    expect(screen.getAllByText('not comparable: different differencing')).toHaveLength(2);
  });
});
