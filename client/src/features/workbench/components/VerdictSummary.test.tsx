import { screen, within } from '@testing-library/react';
import type { SeriesCheckDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { VerdictSummary } from './VerdictSummary';

const check = (diff: number[], label: string, problems: SeriesCheckDto['problems'], summary: string) => ({ diff, label, problems, summary }) as SeriesCheckDto;

describe('stationarity verdict summary', () => {
  it('shows the headline, what each version still has, and marks the suggested differencing', () => {
    renderWithProviders(
      <VerdictSummary
        verdict={{ headline: 'As recorded, the load is not stationary: a daily pattern and a weekly pattern. (1−B^168) removes it.', problems: ['daily', 'weekly'], recommended: [168], recommendedLabel: '(1−B^168)' }}
        checks={[
          check([], 'as recorded', ['daily', 'weekly'], 'As recorded, not stationary: a daily pattern and a weekly pattern.'),
          check([24], '(1−B^24)', ['weekly'], 'After (1−B^24), not stationary: a weekly pattern.'),
          check([168], '(1−B^168)', [], 'After (1−B^168) nothing is left to remove.'),
        ]}
      />,
    );
    const box = screen.getByTestId('stationarity-verdict');
    expect(box).toHaveTextContent('(1−B^168) removes it');
    const raw = screen.getByTestId('verdict-raw');
    expect(raw).toHaveTextContent('daily pattern');
    expect(raw).toHaveTextContent('weekly pattern');
    expect(within(raw).queryByText('suggested')).not.toBeInTheDocument();
    expect(screen.getByTestId('verdict-24')).toHaveTextContent('weekly pattern');
    expect(screen.getByTestId('verdict-24')).not.toHaveTextContent('daily pattern');
    const weekly = screen.getByTestId('verdict-168');
    expect(within(weekly).getByText('suggested')).toBeInTheDocument();
    expect(weekly).toHaveTextContent('nothing is left to remove');
  });

  it('suggests nothing when no differencing removes everything', () => {
    renderWithProviders(
      <VerdictSummary
        verdict={{ headline: 'None of the candidate differencings removes all of it.', problems: ['variance'], recommended: null, recommendedLabel: null }}
        checks={[check([], 'as recorded', ['variance'], 'x'), check([24], '(1−B^24)', ['variance'], 'y')]}
      />,
    );
    expect(screen.queryByText('suggested')).not.toBeInTheDocument();
    expect(screen.getByTestId('verdict-24')).toHaveTextContent('changing spread');
  });

  it('marks the differencing the model in service uses, not the tests\' own pick', () => {
    renderWithProviders(
      <VerdictSummary
        verdict={{ headline: 'The model in service (version 41) uses (1−B^168).', problems: ['daily', 'weekly'], recommended: [168], recommendedLabel: '(1−B^168)', recommendedBy: 'model', inUse: { versionId: 41, diff: [168], label: '(1−B^168)' }, testsPick: [24, 168] }}
        checks={[check([], 'as recorded', ['daily'], 'x'), check([168], '(1−B^168)', ['variance'], 'y'), check([24, 168], '(1−B^24)(1−B^168)', [], 'z')]}
      />,
    );
    expect(within(screen.getByTestId('verdict-168')).getByText('suggested')).toBeInTheDocument();
    expect(within(screen.getByTestId('verdict-168')).getByText('in use by version 41')).toBeInTheDocument();
    expect(within(screen.getByTestId('verdict-24x168')).queryByText('suggested')).not.toBeInTheDocument();
  });
});
