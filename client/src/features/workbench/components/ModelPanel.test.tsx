import type { ModelReportDto } from '@morrowline/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { ModelPanel } from './ModelPanel';

/** A report that falls back, so only the summary and the differencings tried are drawn. */
function report(): ModelReportDto {
  return {
    zone: 'QUARRY',
    weeks: 8,
    from: '2026-10-01T00:00:00Z',
    to: '2026-11-26T00:00:00Z',
    usableHours: 1344,
    method: 'seasonal-naive',
    fallbackReason: 'for this test',
    model: null,
    candidates: [
      { diff: [24], label: '(1−B^24)', p: 2, q: 3, aicc: 9181.04, mape: 8.921, recentMape: 9.404, chosen: false },
      { diff: [168], label: '(1−B^168)', p: 2, q: 0, seasonal: { P: 1, Q: 1 }, aicc: 7465.8, mape: 3.82, recentMape: 3.1, chosen: true },
      { diff: [1, 168], label: '(1−B)(1−B^168)', p: null, q: null, aicc: null, mape: null, recentMape: null, error: 'history too short for this differencing', chosen: false },
    ],
    baselineMape: 3.94,
    selectionDays: 28,
    halfLifeDays: 14,
    warnings: [],
    summary: 'The desk would fall back.',
    computedAt: '2026-11-26T00:05:00Z',
    computeMs: 12,
  };
}

describe('ModelPanel: the differencings tried', () => {
  it('names each differencing with the orders it kept, the seasonal block among them, or why it failed', () => {
    renderWithProviders(<ModelPanel report={report()} />);
    const rows = within(screen.getByRole('table', { name: 'Candidates' })).getAllByRole('row');
    expect(rows[0].textContent).toMatch(/Orders kept \(lowest AICc, then day-ahead error\)AICcRecent MAPEMAPE/);
    // the recency-weighted MAPE the choice goes by, beside the plain mean
    expect(rows[1].textContent).toMatch(/\(1−B\^24\)ARMA\(2,3\)9181\.09\.40 %8\.92 %/);
    expect(rows[2].textContent).toMatch(/\(1−B\^168\)ARMA\(2,0\)×\(1,1\)_247465\.83\.10 %3\.82 %chosen/);
    expect(rows[3].textContent).toMatch(/history too short for this differencing/);
    expect(rows[4].textContent).toMatch(/same hour last weekbaseline3\.94 %/);
    expect(screen.getByRole('columnheader', { name: 'Recent MAPE' }).getAttribute('title')).toMatch(/halving every 14 days back/);
  });
});
