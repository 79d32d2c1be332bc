import { readFile } from 'node:fs/promises';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';

const HOUR_MS = 3_600_000;
/** Four hours three days ago, inside the download's default range (the last seven operating days). */
const base = Math.floor((Date.now() - 3 * 24 * HOUR_MS) / HOUR_MS) * HOUR_MS;
const hour = (k: number) => new Date(base + k * HOUR_MS).toISOString();

// Line 1 is the header; line 4 has a load that is not a number, line 6 a time off the hour.
const CSV = [
  'timestamp,load_mw',
  `${hour(0)},101.5`,
  `${hour(1)},99.25`,
  `${hour(2)},about ninety`,
  `${hour(3)},97`,
  `${new Date(base + 4 * HOUR_MS + 30 * 60_000).toISOString()},96`,
].join('\n');

// Harrow Flats: no other browser test writes readings there, so the download holds only these rows.
describe('history', () => {
  let desk: Desk;

  beforeEach(async () => {
    desk = await openDesk();
  });

  afterEach(async () => {
    await desk?.close();
  });

  it('uploads a CSV without a zone column for a chosen zone and names the bad rows by line', async () => {
    const { page } = desk;
    await signInAs(page, demoUser('operator'));
    await page.getByRole('link', { name: 'History' }).click();
    await page.locator('input[type="file"]').setInputFiles({ name: 'harrow-flats-backfill.csv', mimeType: 'text/csv', buffer: Buffer.from(CSV) });
    await page.getByText('The file has no zone column').waitFor();
    const upload = page.getByRole('button', { name: 'Upload and check' });
    expect(await upload.isDisabled()).toBe(true);

    await page.getByRole('combobox', { name: 'Zone for every row' }).click();
    await page.getByRole('option', { name: 'Harrow Flats (HARROW)' }).click();
    await upload.click();

    const report = page.getByTestId('upload-report');
    await report.waitFor();
    expect(await page.getByTestId('report-rows').innerText()).toBe('5');
    expect(await page.getByTestId('report-accepted').innerText()).toBe('3');
    expect(await page.getByTestId('report-rejected').innerText()).toBe('2');
    const rows = page.getByRole('table', { name: 'Rejected rows' }).locator('tbody tr');
    expect(await rows.count()).toBe(2);
    expect(await rows.nth(0).innerText()).toMatch(/^4\s+Load is not a number/);
    expect(await rows.nth(1).innerText()).toMatch(/^6\s+Not on the hour/);
    await screenshot(page, 'history-upload-report');

    // The good rows are stored: the download for the zone carries them.
    await page.getByRole('combobox', { name: 'Zone', exact: true }).click();
    await page.getByRole('option', { name: 'Harrow Flats (HARROW)' }).click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^readings-harrow-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.csv$/);
    const text = await readFile(await download.path(), 'utf8');
    expect(text.split('\n')[0]).toBe('timestamp,load_mw,zone,quality');
    expect(text).toContain(`${hour(0)},101.5,HARROW`);
    expect(text).toContain(`${hour(3)},97,HARROW`);
    expect(text).not.toContain(hour(2));
  });

  it('lets a viewer download but not upload', async () => {
    const { page } = desk;
    await signInAs(page, demoUser('viewer'));
    await page.getByRole('link', { name: 'History' }).click();
    await page.getByRole('button', { name: 'Download CSV' }).waitFor();
    expect(await page.locator('input[type="file"]').count()).toBe(0);
    expect(await page.getByText('Operators and supervisors upload history').count()).toBe(1);
    await screenshot(page, 'history-viewer');
  });
});
