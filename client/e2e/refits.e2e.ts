import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoUser, openDesk, signInAs, type Desk } from './support/browser';
import { apiToken, historyCsv, QUARRY_LOAD, uploadHistory } from './support/history';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ZONE = 'QUARRY';
const TIME_ZONE = 'America/Denver';
const SCREENSHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));

describe('refits', () => {
  let desk: Desk;

  beforeAll(async () => {
    await uploadHistory(await apiToken('operator'), ZONE, historyCsv(8 * 168 + 4 * 24, QUARRY_LOAD), 'quarry-history.csv');
    desk = await openDesk();
  });
  afterAll(async () => {
    await desk?.close();
  });

  it('marks an outage, refits the zone, compares the candidate, promotes it and sees its forecast live', async () => {
    const page = desk.page;
    await mkdir(SCREENSHOTS, { recursive: true });
    await signInAs(page, demoUser('operator'));
    await page.getByRole('link', { name: 'Refits' }).click();
    await page.getByTestId('refits-choose-zone').waitFor({ state: 'visible' });
    await page.locator('input[aria-label="Zone"]').click();
    await page.getByRole('option', { name: /Quarry Hill/ }).click();
    await page.waitForURL('**/refits?zone=QUARRY');

    // An outage two days ago (inside the live view's chart), 09:00 to 13:00 Quarry Hill time.
    const day = DateTime.now().setZone(TIME_ZONE).minus({ days: 2 }).toFormat('yyyy-LL-dd');
    const windows = page.getByTestId('outage-windows');
    await windows.getByText('No windows marked on Quarry Hill.').waitFor();
    await windows.getByRole('button', { name: 'Mark a window' }).click();
    const dialog = page.getByRole('dialog', { name: 'Mark a window on Quarry Hill' });
    await dialog.getByLabel(/^Start/).fill(`${day}T09:00`);
    // the desk's clock rule: the zone's time with its abbreviation, UTC labelled, no raw ISO offset
    const hint = await dialog.getByTestId('outage-time-hint').first().innerText();
    expect(hint).toMatch(new RegExp(`^${day} 09:00 M[SD]T \\(\\d{4}-\\d{2}-\\d{2} 1[56]:00 UTC\\)`));
    expect(hint).not.toMatch(/T09:00:00/);
    await dialog.getByLabel(/^End/).fill(`${day}T08:00`);
    await dialog.getByLabel(/^Note/).fill('Quarry Hill feeder 4 tripped at the pumping station');
    await dialog.getByRole('button', { name: 'Mark the window' }).click();
    await dialog.getByText('The end must be after the start').waitFor();
    await dialog.getByLabel(/^End/).fill(`${day}T13:00`);
    await dialog.getByRole('button', { name: 'Mark the window' }).click();
    await dialog.waitFor({ state: 'hidden' });
    const row = windows.getByRole('table', { name: 'Windows' }).getByRole('row').nth(1);
    await row.waitFor();
    expect(await row.innerText()).toMatch(new RegExp(`outage[\\s\\S]*${day} 09:00[\\s\\S]*${day} 13:00[\\s\\S]*feeder 4[\\s\\S]*@tallowmere`, "i"));
    await page.addStyleTag({ content: 'header { position: static !important; }' });
    await windows.screenshot({ path: path.join(SCREENSHOTS, 'refits-windows.png') });

    // First refit: the zone's first model goes straight into service.
    const startRefit = async (reason: string) => {
      await page.getByRole('button', { name: 'Refit this zone' }).click();
      const refit = page.getByRole('dialog', { name: 'Refit Quarry Hill' });
      await refit.getByRole('button', { name: 'Start the refit' }).click();
      await refit.getByText(/Say why/).waitFor();
      await refit.getByLabel(/^Reason/).fill(reason);
      await refit.getByRole('button', { name: 'Start the refit' }).click();
      await refit.waitFor({ state: 'hidden' });
    };
    const versions = page.getByTestId('model-versions');
    await startRefit('after the Quarry Hill feeder outage');
    // The panel lists every zone's jobs: follow ours by its id, so another zone's finishing cannot stand in.
    const ourJob = page.locator('[data-testid^="refit-job-"]', { hasText: 'after the Quarry Hill feeder outage' }).first();
    await ourJob.waitFor();
    const firstJob = page.getByTestId((await ourJob.getAttribute('data-testid'))!);
    await page.getByTestId('refit-panel').screenshot({ path: path.join(SCREENSHOTS, 'refits-progress.png') });
    await firstJob.and(page.locator('[data-state="done"]')).waitFor({ timeout: 180_000 });
    expect(await firstJob.innerText()).toMatch(/Quarry Hill[\s\S]*by hand[\s\S]*done[\s\S]*100 %[\s\S]*into service[\s\S]*feeder outage/i);
    const inService = versions.locator('[data-status="in-service"]');
    await inService.waitFor({ timeout: 30_000 });
    expect(await inService.innerText()).toMatch(/in service[\s\S]*refit by hand[\s\S]*ARMA\(\d,\d\)(×\(\d,\d\)_24)? on \(1−B(\^(24|168))?\)[\s\S]*4 h left out[\s\S]*\d+\.\d\d %[\s\S]*\d+\.\d\d %/i);
    const firstVersion = await inService.getAttribute('data-testid');

    // Second refit: a candidate beside the model in service.
    await startRefit('second look after the feeder outage');
    const candidate = versions.locator('[data-status="candidate"]');
    await candidate.waitFor({ timeout: 180_000 });
    expect(await page.locator('[data-testid^="refit-job-"][data-state="done"]').count()).toBeGreaterThanOrEqual(2);
    expect(await page.locator('[data-testid^="refit-job-"]').first().innerText()).toMatch(/done[\s\S]*100 %/i);
    await page.getByTestId('refit-panel').screenshot({ path: path.join(SCREENSHOTS, 'refits-jobs-done.png') });
    await versions.screenshot({ path: path.join(SCREENSHOTS, 'refits-versions.png') });
    const candidateId = await candidate.getAttribute('data-testid');

    await candidate.getByRole('button', { name: 'Compare' }).click();
    const compare = page.getByRole('dialog', { name: /beside the model in service/ });
    const verdict = compare.getByTestId('compare-verdict');
    await verdict.waitFor({ timeout: 120_000 });
    expect(await verdict.innerText()).toMatch(/Over the same \d+ days this version is (not )?better: \d+\.\d{2,4} % against \d+\.\d{2,4} %[\s\S]*one week earlier scores \d+\.\d\d %/);
    const table = await compare.getByRole('table', { name: 'Comparison' }).innerText();
    expect(table).toMatch(/Backtest MAPE, same \d+ days/);
    expect(table).toMatch(/AICc[\s\S]*BIC[\s\S]*Ljung–Box/);
    expect(await compare.getByRole('table', { name: 'Coefficients, In service' }).innerText()).toMatch(/(ar|ma)\d/);
    await compare.screenshot({ path: path.join(SCREENSHOTS, 'refits-compare.png') });
    await compare.getByRole('button', { name: 'Promote' }).click();
    await compare.getByText('Say why this version should forecast the zone').waitFor();
    await compare.getByLabel(/^Reason/).fill('cleaner fit after the feeder outage was left out');
    await compare.getByRole('button', { name: 'Promote' }).click();
    await compare.waitFor({ state: 'hidden' });
    await versions.locator(`[data-testid="${candidateId}"][data-status="in-service"]`).waitFor();
    await versions.locator(`[data-testid="${firstVersion}"][data-status="retired"]`).waitFor();
    await expect(versions.getByRole('button', { name: 'Compare / roll back' }).count()).resolves.toBe(1);

    // The live view shows the model's forecast, not the week-earlier stand-in.
    await page.getByRole('link', { name: 'Live load' }).click();
    await page.getByTestId(`zone-card-${ZONE}`).click();
    await page.waitForURL(`**/live?zone=${ZONE}`);
    const caption = page.getByText(/^Forecast: /);
    await page.getByText(/^Forecast: Model forecast issued/).waitFor({ timeout: 30_000 });
    expect(await caption.innerText()).not.toMatch(/Seasonal-naive stand-in/);
    await page.getByTestId('chart-legend').getByText('Outage or bad-data window: not normal load').waitFor();
    await page.getByTestId('load-chart').locator('canvas').first().waitFor({ state: 'attached' });
    await page.screenshot({ path: path.join(SCREENSHOTS, 'refits-live-forecast.png'), fullPage: true });
  }, 480_000);
});
