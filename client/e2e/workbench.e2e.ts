import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, signInAs, type Desk } from './support/browser';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const HOUR = 3_600_000;
const ZONE = 'MILLRACE';
const SCREENSHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));

/**
 * Eight weeks of hourly Millrace load (the test database has the demo zones but no readings):
 * morning and evening peaks, lower weekends, AR(1) noise from a fixed seed.
 */
function historyCsv(hours: number): string {
  const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
  let seed = 424242;
  const uniform = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) + 1) / (2 ** 31 + 1);
  const gauss = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  let noise = 0;
  const rows = ['timestamp,load_mw'];
  for (let i = 0; i < hours; i++) {
    const at = last - (hours - 1 - i) * HOUR;
    const local = new Date(at - 7 * HOUR);
    const h = local.getUTCHours();
    const day = local.getUTCDay();
    const daily = 30 * Math.exp(-((h - 8) ** 2) / 6) + 45 * Math.exp(-((h - 19) ** 2) / 8) - 18 * Math.exp(-((h - 3) ** 2) / 10);
    const weekend = day === 0 || day === 6 ? -30 - 0.4 * daily : 0;
    noise = 0.7 * noise + 4 * gauss();
    rows.push(`${new Date(at).toISOString()},${(170 + daily + weekend + noise).toFixed(2)}`);
  }
  return rows.join('\n') + '\n';
}

async function seedReadings(): Promise<void> {
  const operator = demoUser('operator');
  const login = await fetch(`${BASE_URL}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: operator.email, password: operator.password }) });
  expect(login.status).toBe(200);
  const { accessToken } = (await login.json()) as { accessToken: string };
  const form = new FormData();
  form.append('file', new Blob([historyCsv(8 * 168 + 4 * 24)], { type: 'text/csv' }), 'millrace-history.csv');
  const upload = await fetch(`${BASE_URL}/api/readings/upload?zone=${ZONE}`, { method: 'POST', headers: { Authorization: `Bearer ${accessToken}` }, body: form });
  const report = (await upload.json()) as { accepted: number; rejectedCount: number };
  expect(upload.status).toBe(201);
  expect(report.rejectedCount).toBe(0);
}

describe('model workbench', () => {
  let desk: Desk;

  beforeAll(async () => {
    await seedReadings();
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
    await page.getByTestId('model-panel').screenshot({ path: path.join(SCREENSHOTS, 'workbench-model.png') });

    await page.getByTestId('backtest-panel').getByText('7 days', { exact: true }).click();
    await page.getByRole('button', { name: 'Run backtest' }).click();
    const result = page.getByTestId('backtest-result');
    await result.waitFor({ state: 'visible', timeout: 120_000 });
    expect(await result.innerText()).toMatch(/Over 7 days/);
    const scores = await page.getByRole('table', { name: 'Backtest scores' }).innerText();
    expect(scores).toMatch(/MAPE\s+\d+\.\d+ %\s+\d+\.\d+ %/);
    await page.getByTestId('chart-backtest-daily').locator('canvas').first().waitFor({ state: 'attached' });
    await page.getByTestId('backtest-panel').screenshot({ path: path.join(SCREENSHOTS, 'workbench-backtest.png') });
  }, 240_000);
});
