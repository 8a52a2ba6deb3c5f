import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from '../../src/features/auth/components/sign-in-form';

function renderForm(onSignedIn = vi.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <SignInForm onSignedIn={onSignedIn} />
    </QueryClientProvider>,
  );
  return { onSignedIn };
}

/** A fetch that answers the CSRF request and then the sign-in request as the server would. */
function fakeServer(signInStatus: number, signInBody: unknown) {
  const fetchMock = vi.fn(async (url: string) => {
    if (url === '/api/auth/csrf') return new Response(JSON.stringify({ token: 't' }), { status: 200 });
    return new Response(JSON.stringify(signInBody), { status: signInStatus, headers: { 'Content-Type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('the sign-in form', () => {
  it('shows field errors beside the fields and sends nothing when they are empty', async () => {
    const fetchMock = fakeServer(200, {});
    renderForm();
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter a valid e-mail address.')).toBeInTheDocument();
    expect(screen.getByText('Password is required.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("shows the server's generic message when the credentials are wrong", async () => {
    fakeServer(401, { error: { code: 'unauthorized', message: 'That e-mail and password do not match an active account.' } });
    const { onSignedIn } = renderForm();
    await userEvent.type(screen.getByLabelText('E-mail'), 'therapist@mendstep.test');
    await userEvent.type(screen.getByLabelText('Password'), 'wrong-password-here');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('That e-mail and password do not match an active account.')).toBeInTheDocument();
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('says so when the server cannot be reached', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    renderForm();
    await userEvent.type(screen.getByLabelText('E-mail'), 'therapist@mendstep.test');
    await userEvent.type(screen.getByLabelText('Password'), 'demo-table-2026');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(/Could not reach Mendstep/)).toBeInTheDocument();
  });

  it('hands the signed-in user on, with the CSRF token sent in its header', async () => {
    const user = { id: '0b000000-0000-4000-8000-000000000001', email: 'therapist@mendstep.test', name: 'T', role: 'therapist', clinicId: '0a000000-0000-4000-8000-000000000001' };
    const fetchMock = fakeServer(200, { user });
    const { onSignedIn } = renderForm();
    await userEvent.type(screen.getByLabelText('E-mail'), 'Therapist@Mendstep.test');
    await userEvent.type(screen.getByLabelText('Password'), 'demo-table-2026');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(onSignedIn).toHaveBeenCalled());
    expect(onSignedIn.mock.calls[0][0]).toEqual(user);
    const [, init] = fetchMock.mock.calls.find(([url]) => url === '/api/auth/login') as unknown as [string, RequestInit];
    expect((init.headers as Record<string, string>)['X-CSRF-Token']).toBe('t');
    expect(JSON.parse(init.body as string)).toEqual({ email: 'therapist@mendstep.test', password: 'demo-table-2026' });
  });
});
