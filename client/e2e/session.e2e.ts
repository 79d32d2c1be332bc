import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoUser, fillSignIn, openDesk, screenshot, signInAs, type Desk } from './support/browser';

describe('signing in and out', () => {
  let desk: Desk;

  beforeEach(async () => {
    desk = await openDesk();
  });

  afterEach(async () => {
    await desk?.close();
  });

  it('answers a wrong password with one neutral message', async () => {
    const viewer = demoUser('viewer');
    await desk.page.goto('/sign-in');
    await fillSignIn(desk.page, viewer.email, `${viewer.password}-wrong`);

    const error = desk.page.getByTestId('sign-in-error');
    await error.waitFor({ state: 'visible' });
    expect(await error.innerText()).toBe('That e-mail and password do not match an active account.');
    expect(await desk.page.getByTestId('signed-in-name').count()).toBe(0);
    await screenshot(desk.page, 'sign-in-wrong-password');
  });

  it('signs out, and the desk is closed until the next sign-in', async () => {
    await signInAs(desk.page, demoUser('operator'));
    await desk.page.getByRole('button', { name: 'Sign out' }).click();

    await desk.page.waitForURL('**/sign-in');
    await desk.page.goto('/refits');
    await desk.page.waitForURL('**/sign-in');
    // Waits (up to the default timeout) rather than sampling once: the form renders after the redirect.
    await desk.page.getByRole('button', { name: 'Sign in' }).waitFor({ state: 'visible' });
    expect(await desk.page.evaluate(() => window.sessionStorage.getItem('morrowline.session'))).toBeNull();
  });

  it('returns to sign-in when the session expires, then back to the page', async () => {
    const operator = demoUser('operator');
    await signInAs(desk.page, operator);
    await desk.page.goto('/accuracy?zone=MILLRACE');
    await desk.page.getByRole('heading', { name: 'Accuracy' }).waitFor();

    // Pretend the token runs out in a moment; the app's timer must notice without any click.
    await desk.page.evaluate(() => {
      const stored = JSON.parse(window.sessionStorage.getItem('morrowline.session') ?? '{}');
      window.sessionStorage.setItem('morrowline.session', JSON.stringify({ ...stored, expiresAt: Date.now() + 1500 }));
    });
    await desk.page.reload();
    await desk.page.getByTestId('session-expired').waitFor({ state: 'visible', timeout: 10_000 });
    expect(await desk.page.getByTestId('session-expired').innerText()).toBe('Your session has expired, please sign in again');
    await screenshot(desk.page, 'sign-in-session-expired');

    await fillSignIn(desk.page, operator.email, operator.password);
    await desk.page.waitForURL('**/accuracy?zone=MILLRACE');
  });
});
