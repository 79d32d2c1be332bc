import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { apiError, mockApi } from '../../../test/mock-api';
import { renderWithProviders } from '../../../test/render';
import { TOO_MANY_ATTEMPTS_MESSAGE, WRONG_CREDENTIALS_MESSAGE } from '../sign-in-messages';
import { SignInForm } from './SignInForm';

async function fillIn(email: string, password: string) {
  const user = userEvent.setup();
  await user.type(screen.getByLabelText('E-mail'), email);
  await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('sign-in form', () => {
  it('shows one neutral message for a wrong password and keeps no session', async () => {
    mockApi({
      'POST /api/auth/login': () => ({ status: 401, body: apiError(401, 'Unauthorized', 'Wrong password for this user') }),
    });
    const onSignedIn = vi.fn();
    renderWithProviders(<SignInForm onSignedIn={onSignedIn} />);

    await fillIn('pia.lund@tallowmere.example', 'not-her-password');

    const alert = await screen.findByTestId('sign-in-error');
    expect(alert).toHaveTextContent(WRONG_CREDENTIALS_MESSAGE);
    // The server's own wording (which might say which part was wrong) is not passed on.
    expect(screen.queryByText(/Wrong password for this user/)).not.toBeInTheDocument();
    expect(screen.getByLabelText('Password')).toHaveValue('');
    expect(sessionStore.token()).toBeNull();
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('asks the user to wait after too many attempts', async () => {
    mockApi({ 'POST /api/auth/login': () => ({ status: 429, body: apiError(429, 'Too Many Requests', 'Slow down') }) });
    renderWithProviders(<SignInForm onSignedIn={vi.fn()} />);

    await fillIn('pia.lund@tallowmere.example', 'whatever');

    expect(await screen.findByTestId('sign-in-error')).toHaveTextContent(TOO_MANY_ATTEMPTS_MESSAGE);
  });

  it('stores the token and reports the user on success', async () => {
    const user = userFixture('operator');
    const { calls } = mockApi({
      'POST /api/auth/login': () => ({ body: { accessToken: 'jwt-1', tokenType: 'Bearer', expiresIn: 3600, user } }),
    });
    const onSignedIn = vi.fn();
    renderWithProviders(<SignInForm onSignedIn={onSignedIn} />);

    await fillIn(`  ${user.email} `, 'operator-demo');

    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(user));
    expect(calls[0].body).toEqual({ email: user.email, password: 'operator-demo' });
    expect(sessionStore.token()).toBe('jwt-1');
  });

  it('does not call the server when the fields are not filled in', async () => {
    const { fetchMock } = mockApi({});
    renderWithProviders(<SignInForm onSignedIn={vi.fn()} />);

    await userEvent.setup().click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(fetchMock).not.toHaveBeenCalled();
  });
});
