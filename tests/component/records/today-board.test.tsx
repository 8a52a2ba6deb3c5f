import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { TodayBoard } from '../../../src/features/today/components/today-board';
import { fakeServer, hoursAgo, makeInjury, renderWithProviders } from './harness';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('Today', () => {
  it("lists the clinic's open injuries with each phase as a word, and links to start a run and to the injury", async () => {
    const acute = makeInjury({ athleteName: 'Rowan Tesk', injuredHoursAgo: 20, measurements: [{ takenAt: hoursAgo(2), kneeFlexionDeg: 80 }] });
    const proliferative = makeInjury({ athleteName: 'Idris Mallory', region: 'calf', side: 'right', injuredHoursAgo: 24 * 10, remeasureDue: true });
    const remodelling = makeInjury({ athleteName: 'Noor Haverstock', injuredHoursAgo: 24 * 27 });
    const calls = fakeServer((method, url) => (method === 'GET' && url === '/api/injuries?status=open' ? { body: { items: [acute, proliferative, remodelling] } } : undefined));
    renderWithProviders(<TodayBoard />);

    const list = await screen.findByRole('list', { name: 'Open injuries' });
    const cards = within(list).getAllByRole('listitem');
    expect(cards).toHaveLength(3);
    expect(within(cards[0]).getByRole('heading', { name: 'Rowan Tesk' })).toBeInTheDocument();
    expect(within(cards[0]).getByTestId('phase')).toHaveTextContent('Acute phase');
    expect(within(cards[0]).getByText('Anterior thigh (quadriceps), left')).toBeInTheDocument();
    expect(within(cards[0]).getByText('day 0')).toBeInTheDocument();
    // Ryan et al. 1991: 45°–90° of knee flexion is moderate.
    expect(within(cards[0]).getByText('Moderate (80° knee flexion)')).toBeInTheDocument();
    expect(within(cards[1]).getByTestId('phase')).toHaveTextContent('Proliferative phase');
    expect(within(cards[1]).getByText('Re-measure due')).toBeInTheDocument();
    expect(within(cards[1]).getByText('Not graded')).toBeInTheDocument();
    expect(within(cards[2]).getByTestId('phase')).toHaveTextContent('Remodelling phase');

    expect(within(cards[0]).getByRole('link', { name: /^Start a run/ })).toHaveAttribute('href', `/runs/new?injuryId=${acute.id}`);
    expect(within(cards[0]).getByRole('link', { name: /^Open injury/ })).toHaveAttribute('href', `/injuries/${acute.id}`);
    expect(screen.getByText('3 open injuries')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Register an athlete' })).toHaveAttribute('href', '/athletes?new=1');
    expect(calls).toHaveLength(1);
  });

  it('says when there are no open injuries and points to the athletes', async () => {
    fakeServer(() => ({ body: { items: [] } }));
    renderWithProviders(<TodayBoard />);
    expect(await screen.findByText('No open injuries')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to athletes' })).toHaveAttribute('href', '/athletes');
  });
});
