import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoUser, openDesk, signInAs, type Desk } from './support/browser';
import { apiToken, historyCsv, MILLRACE_LOAD, uploadHistory } from './support/history';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ZONE = 'MILLRACE';
const SCREENSHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));

describe('model workbench', () => {
  let desk: Desk;

  beforeAll(async () => {
    await uploadHistory(await apiToken('operator'), ZONE, historyCsv(8 * 168 + 4 * 24, MILLRACE_LOAD), 'millrace-history.csv');
    desk = await openDesk();
  });
  afterAll(async () => {
    await desk?.close();
  });

  it('shows an operator the stationarity verdict, the correlograms, the model and a backtest for a demo zone', async () => {
    const page = desk.page;
    await signInAs(page, demoUser('operator'));
    await page.getByRole('link', { name: 'Model workbench' }).click();
    await page.getByTestId('workbench-choose-zone').waitFor({ state: 'visible' });
    await page.locator('input[aria-label="Zone"]').click();
    await page.getByRole('option', { name: /Millrace/ }).click();

    const verdict = page.getByTestId('stationarity-verdict');
    await verdict.waitFor({ state: 'visible', timeout: 60_000 });
    expect(await verdict.innerText()).toMatch(/not stationary/);
    expect(await page.getByTestId('verdict-raw').innerText()).toMatch(/daily pattern/);
    for (const chart of ['chart-series', 'chart-rolling-mean', 'chart-rolling-variance', 'chart-acf-raw', 'chart-pacf-raw', 'chart-acf-differenced']) {
      await page.getByTestId(chart).locator('canvas').first().waitFor({ state: 'attached' });
    }
    expect(await page.getByRole('table', { name: 'Unit-root and level tests' }).innerText()).toContain('KPSS, level');
    // our own key under the lines, not the chart library's "time: -- load: --" legend
    expect(await page.locator('.u-legend').count()).toBe(0);
    expect(await page.getByTestId('chart-series').getByTestId('chart-key').innerText()).toMatch(/weekly mean/i);
    await mkdir(SCREENSHOTS, { recursive: true });
    // the fixed header would cover the top of each panel in its screenshot
    await page.addStyleTag({ content: 'header { position: static !important; }' });
    await page.getByTestId('stationarity-panel').screenshot({ path: path.join(SCREENSHOTS, 'workbench-stationarity.png') });

    const orders = page.getByTestId('model-orders');
    await orders.waitFor({ state: 'visible', timeout: 60_000 });
    expect(await orders.innerText()).toMatch(/ARMA\(\d,\d\)/);
    expect(await orders.innerText()).toMatch(/\(1−B\^(24|168)\)/);
    const coefficients = page.getByRole('table', { name: 'Coefficients' });
    expect(await coefficients.innerText()).toMatch(/(ar|ma)1/);
    expect(await page.getByRole('table', { name: 'Ljung–Box' }).innerText()).toMatch(/24 h[\s\S]*48 h/);
    await page.getByTestId('chart-residual-acf').locator('canvas').first().waitFor({ state: 'attached' });
    // the differencing is chosen on four weeks of day-ahead origins, as the desk's refits choose it
    expect(await page.getByTestId('model-panel').innerText()).toMatch(/Differencings tried \(day-ahead error over the last 28 days; the choice weighs recent days more\)/);
    await page.getByTestId('model-panel').screenshot({ path: path.join(SCREENSHOTS, 'workbench-model.png') });

    await page.getByTestId('backtest-panel').getByText('7 days', { exact: true }).click();
    await page.getByRole('button', { name: 'Run backtest' }).click();
    const result = page.getByTestId('backtest-result');
    await result.waitFor({ state: 'visible', timeout: 120_000 });
    expect(await result.innerText()).toMatch(/Over 7 days/);
    expect(await page.getByTestId('backtest-issue-time').innerText()).toMatch(/Each day forecast at the \d{2}:\d{2} gate closure the day before \([A-Za-z_/]+\)/);
    const scores = await page.getByRole('table', { name: 'Backtest scores' }).innerText();
    expect(scores).toMatch(/MAPE\s+\d+\.\d+ %\s+\d+\.\d+ %/);
    await page.getByTestId('chart-backtest-daily').locator('canvas').first().waitFor({ state: 'attached' });
    expect(await page.getByTestId('chart-backtest-daily').locator('.u-legend').count()).toBe(0);
    expect(await page.getByTestId('chart-backtest-daily').getByTestId('chart-key').innerText()).toMatch(/model MAPE %[\s\S]*same hour last week MAPE %/);
    await page.getByTestId('backtest-panel').screenshot({ path: path.join(SCREENSHOTS, 'workbench-backtest.png') });
  }, 240_000);
});
