import { DateTime } from 'luxon';
import type { ModelVersionDto, RefitJobDto } from '@morrowline/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, historyCsv, uploadHistory, type LoadShape } from './support/history';
import { ownZone } from './support/zones';

const ZONE = 'BRAMBLE';
const NAME = 'Bramblewick';
const TIME_ZONE = 'America/Denver';

/** Bramblewick: a small market town, a midday peak. */
const BRAMBLE_LOAD: LoadShape = {
  seed: 515151,
  baseMw: 120,
  daily: (h) => 28 * Math.exp(-((h - 12) ** 2) / 12) + 18 * Math.exp(-((h - 19) ** 2) / 6) - 14 * Math.exp(-((h - 3) ** 2) / 9),
  weekend: (daily) => -15 - 0.3 * daily,
  noiseMw: 3,
};

async function refit(token: string, reason: string): Promise<RefitJobDto> {
  const auth = { Authorization: `Bearer ${token}` };
  const started = await fetch(`${BASE_URL}/api/models/refits`, { method: 'POST', headers: { ...auth, 'Content-Type': 'application/json' }, body: JSON.stringify({ zone: ZONE, reason }) });
  expect(started.status).toBe(202);
  const id = ((await started.json()) as RefitJobDto[])[0].id;
  for (let i = 0; i < 300; i++) {
    const jobs = (await (await fetch(`${BASE_URL}/api/models/refits?zone=${ZONE}`, { headers: auth })).json()) as RefitJobDto[];
    const job = jobs.find((j) => j.id === id);
    if (job && (job.state === 'done' || job.state === 'failed')) return job;
    await new Promise((r) => setTimeout(r, 1000));
  }
  throw new Error('the refit did not finish');
}

describe('model comparison on the days each version forecast', () => {
  let desk: Desk;
  let inService: ModelVersionDto;

  beforeAll(async () => {
    await ownZone(ZONE, NAME);
    const token = await apiToken('operator');
    // the first model is fitted three days before the latest readings, the candidate on all of them
    const csv = historyCsv(8 * 168 + 4 * 24, BRAMBLE_LOAD);
    const lines = csv.trim().split('\n');
    await uploadHistory(token, ZONE, `${lines.slice(0, lines.length - 72).join('\n')}\n`, 'bramblewick-history-part.csv');
    expect((await refit(token, 'first model of Bramblewick')).promoted).toBe(true);
    await uploadHistory(token, ZONE, csv, 'bramblewick-history.csv');
    const second = await refit(token, 'three more days of Bramblewick readings');
    expect(second.state).toBe('done');
    const versions = (await (await fetch(`${BASE_URL}/api/models?zone=${ZONE}`, { headers: { Authorization: `Bearer ${token}` } })).json()) as ModelVersionDto[];
    inService = versions.find((v) => v.status === 'in-service')!;
    expect(versions.some((v) => v.status === 'candidate')).toBe(true);
    desk = await openDesk();
  }, 600_000);
  afterAll(async () => {
    await desk?.close();
  });

  it('scores the candidate and the model in service on the same seven days, each forecast at the gate closure the day before', async () => {
    const page = desk.page;
    await signInAs(page, demoUser('operator'));
    await page.goto(`/refits?zone=${ZONE}`);
    const versions = page.getByTestId('model-versions');
    const candidate = versions.locator('[data-status="candidate"]').first();
    await candidate.waitFor({ timeout: 30_000 });
    await candidate.getByRole('button', { name: 'Compare' }).click();
    const compare = page.getByRole('dialog', { name: /beside the model in service/ });
    const verdict = compare.getByTestId('compare-verdict');
    await verdict.waitFor({ timeout: 120_000 });
    expect(await verdict.innerText()).toMatch(/^Over the same 7 days this version is (not )?better: \d+\.\d{2,4} % against \d+\.\d{2,4} % for the model in service\. The same hour one week earlier scores \d+\.\d\d %\.$/);

    // seven whole days, each forecast at 10:00 Bramblewick time the day before
    const days = compare.getByRole('table', { name: 'Scored days' }).locator('tbody tr');
    expect(await days.count()).toBe(7);
    for (let i = 0; i < 7; i++) {
      const [day, at] = (await days.nth(i).innerText()).split(/\s+/);
      const issued = DateTime.fromISO(day, { zone: TIME_ZONE }).minus({ days: 1 }).toFormat('yyyy-LL-dd');
      expect(at).toBe(issued);
      expect(await days.nth(i).innerText()).toMatch(new RegExp(`${issued}\\s+10:00\\s+M[SD]T\\s+\\d+\\.\\d\\d %\\s+\\d+\\.\\d\\d %`));
    }
    const table = await compare.getByRole('table', { name: 'Comparison' }).innerText();
    // the model in service forecast these days before its own run was stored: all re-forecast with its coefficients
    expect(table).toMatch(/Days scored from forecasts[\s\S]*?\s0 as issued, 7 re-forecast\s+0 as issued, 7 re-forecast/);
    expect(table).toMatch(/80 % band held[\s\S]*?\s\d+\.\d\d %\s+\d+\.\d\d %/);
    // fitted on different hours: no badge on the fit criteria or the residual test
    for (const row of ['AICc', 'BIC', 'σ² (MW²)', 'Ljung–Box, lowest p']) {
      expect(await compare.getByTestId(`candidate-${row}`).innerText()).not.toMatch(/better|worse/);
    }
    expect(await compare.innerText()).not.toMatch(/residuals still correlated/);
    await screenshot(page, 'model-comparison');
    await page.keyboard.press('Escape');

    // the workbench marks as suggested the differencing the model in service uses
    await page.goto(`/workbench?zone=${ZONE}`);
    const verdictBox = page.getByTestId('stationarity-verdict');
    await verdictBox.waitFor({ state: 'visible', timeout: 90_000 });
    const used = page.getByTestId(`verdict-${inService.differencing.join('x')}`);
    expect(await used.innerText()).toMatch(new RegExp(`suggested[\\s\\S]*in use by version ${inService.id}`, "i"));
    expect(await verdictBox.innerText()).toContain(`The model in service (version ${inService.id}) uses ${inService.differencingLabel}`);
    const suggested = await page.getByTestId('stationarity-verdict').getByText('suggested', { exact: true }).count();
    expect(suggested).toBe(1);
  }, 420_000);
});
