import type { CsvUploadReport } from '@morrowline/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { UploadReport } from './UploadReport';

const report: CsvUploadReport = {
  fileName: 'millrace-april.csv',
  rows: 1200,
  accepted: 1197,
  revised: 4,
  rejected: [
    { line: 17, reason: 'not-a-number', message: 'load_mw "abc" is not a number' },
    { line: 905, reason: 'not-on-the-hour', message: '2026-04-12T10:30:00Z is not on the hour' },
  ],
  rejectedCount: 3,
};

describe('UploadReport', () => {
  it('shows the counts and each rejected row with its line, reason and detail', () => {
    renderWithProviders(<UploadReport report={report} />);
    expect(screen.getByTestId('report-rows')).toHaveTextContent('1,200');
    expect(screen.getByTestId('report-accepted')).toHaveTextContent('1,197');
    expect(screen.getByTestId('report-revised')).toHaveTextContent('4');
    expect(screen.getByTestId('report-rejected')).toHaveTextContent('3');
    const rows = within(screen.getByRole('table', { name: 'Rejected rows' })).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent('17');
    expect(rows[1]).toHaveTextContent('Load is not a number');
    expect(rows[2]).toHaveTextContent('905');
    expect(rows[2]).toHaveTextContent('Not on the hour');
    expect(screen.getByTestId('rejected-more')).toHaveTextContent('The first 2 of 3 rejected rows are listed.');
  });

  it('says a row with no load is missing its load, not that it is not a number', () => {
    const empty = { line: 12, reason: 'empty-load' as const, message: 'load_mw is empty; a number such as 412.5 is needed' };
    renderWithProviders(<UploadReport report={{ ...report, rejected: [empty], rejectedCount: 1 }} />);
    const rows = within(screen.getByRole('table', { name: 'Rejected rows' })).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('No load given');
    expect(rows[1]).not.toHaveTextContent('not a number');
  });

  it('names an hour given twice in the file as such', () => {
    const duplicate = { line: 41, reason: 'duplicate' as const, message: 'MILLRACE 2024-03-10T08:00:00Z is also on line 40; one hour may appear once per file, so none of these rows was stored' };
    renderWithProviders(<UploadReport report={{ ...report, rejected: [duplicate], rejectedCount: 1 }} />);
    const rows = within(screen.getByRole('table', { name: 'Rejected rows' })).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('41');
    expect(rows[1]).toHaveTextContent('Hour given twice in the file');
    expect(rows[1]).toHaveTextContent('also on line 40');
  });

  it('says every row was accepted and shows no table when nothing was rejected', () => {
    renderWithProviders(<UploadReport report={{ ...report, accepted: 1200, rejected: [], rejectedCount: 0 }} />);
    expect(screen.getByText('Every row was accepted.')).toBeInTheDocument();
    expect(screen.queryByRole('table')).toBeNull();
  });
});
