import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defaultSequences } from '../../../shared/plan/sequence';
import { phases } from '../../../shared/phase';
import type { SequenceView } from '../../../shared/runs/responses';
import { SequenceEditor } from '../../../src/features/sequences/components/sequence-editor';
import { fakeServer, renderAt, uuid } from './harness';

const views: SequenceView[] = phases.map((phase, i) => ({
  ...defaultSequences[phase],
  id: uuid(300 + i),
  version: 3,
  createdAt: '2026-11-01T09:00:00.000Z',
  createdByName: 'Owen Halloway',
}));

function sequenceServer(onPut: (body: unknown) => { status?: number; body: unknown } = (body) => ({ body: { sequence: { ...views[1], ...(body as object), id: uuid(399), version: 4 } } })) {
  let current = views;
  return fakeServer((method, url, body) => {
    if (url !== '/api/sequences') return undefined;
    if (method === 'GET') return { body: { items: current } };
    const reply = onPut(body);
    if (!reply.status) current = current.map((v) => (v.phase === (body as SequenceView).phase ? (reply.body as { sequence: SequenceView }).sequence : v));
    return reply;
  });
}

const proliferative = async () => {
  await userEvent.click(await screen.findByRole('tab', { name: /Proliferative/ }));
  return screen.getByRole('tabpanel', { name: /Proliferative/ });
};
const steps = (panel: HTMLElement) => within(panel).getAllByTestId('sequence-step');

afterEach(() => vi.unstubAllGlobals());

describe('the sequence editor', () => {
  it("shows each step's bounds beside its duration, with the source, under the safety caution", async () => {
    sequenceServer();
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await proliferative();
    expect(screen.getByRole('note')).toHaveTextContent('Bounds are safety rules');
    const ice = steps(panel)[0];
    expect(within(ice).getByRole('group', { name: /Ice massage/ })).toHaveAccessibleDescription(/Allowed 5 min – 7 min/);
    expect(within(ice).getByText(/5–7 min at a time: common practice/)).toBeInTheDocument();
    expect(within(ice).getByLabelText('Minutes')).toHaveValue('6');
    expect(within(ice).getByLabelText('Seconds')).toHaveValue('0');
    expect(within(panel).getByTestId('sequence-version')).toHaveTextContent('Version 3');
  });

  // Ice massage 5–7 min at a time: common practice (clinical-sources.md); 8 min is outside it.
  it('refuses an ice massage of 8 minutes on the step itself and sends nothing', async () => {
    const calls = sequenceServer();
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await proliferative();
    const ice = steps(panel)[0];
    await userEvent.clear(within(ice).getByLabelText('Minutes'));
    await userEvent.type(within(ice).getByLabelText('Minutes'), '8');
    expect(within(ice).getByRole('alert')).toHaveTextContent('Outside the safety bounds');
    expect(within(ice).getByLabelText('Minutes')).toHaveAttribute('aria-invalid', 'true');

    await userEvent.click(within(panel).getByRole('button', { name: 'Save as version 4' }));
    expect(await within(ice).findByText('Ice massage must last between 300 and 420 seconds (5–7 min)')).toBeInTheDocument();
    expect(within(panel).getByText(/Nothing was saved/)).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
  });

  it('accepts 7 minutes exactly, the upper bound', async () => {
    const calls = sequenceServer();
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await proliferative();
    const ice = steps(panel)[0];
    await userEvent.clear(within(ice).getByLabelText('Minutes'));
    await userEvent.type(within(ice).getByLabelText('Minutes'), '7');
    expect(within(ice).queryByRole('alert')).toBeNull();
    await userEvent.click(within(panel).getByRole('button', { name: 'Save as version 4' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1));
    expect((calls.find((c) => c.method === 'PUT')!.body as { steps: { seconds: number }[] }).steps[0].seconds).toBe(420);
  });

  it('moves a step with the keyboard-reachable buttons, keeps focus on it, and saves the new order as a new version', async () => {
    const calls = sequenceServer();
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await proliferative();
    const moveDown = within(panel).getByRole('button', { name: 'Move step 1 (Ice massage) down' });
    await userEvent.click(moveDown);
    expect(within(steps(panel)[0]).getByRole('group')).toHaveAccessibleName(/Light centre-out strokes/);
    expect(document.activeElement).toHaveAccessibleName('Move step 2 (Ice massage) down');
    expect(screen.getByRole('tab', { name: /Proliferative/ })).toHaveTextContent('(unsaved)');

    await userEvent.click(within(panel).getByRole('button', { name: 'Save as version 4' }));
    expect(await within(panel).findByText(/Saved as version 4/)).toBeInTheDocument();
    const sent = calls.find((c) => c.method === 'PUT')!.body as { phase: string; steps: { kind: string }[] };
    expect(sent.phase).toBe('proliferative');
    expect(sent.steps.map((s) => s.kind)).toEqual(['light-strokes', 'ice-massage', 'passive-movement', 'active-movement', 'rest-recheck', 'ice-massage']);
    await waitFor(() => expect(within(panel).getByTestId('sequence-version')).toHaveTextContent('Version 4'));
  });

  it('adds a chosen kind at a length inside its bounds, and removes a step', async () => {
    const calls = sequenceServer();
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await proliferative();
    // Not a cold pack: straight after the closing ice massage it would break the minimum interval between cold steps.
    await userEvent.selectOptions(within(panel).getByLabelText('Kind of step to add'), 'passive-movement');
    await userEvent.click(within(panel).getByRole('button', { name: 'Add step' }));
    expect(steps(panel)).toHaveLength(7);
    await userEvent.click(within(panel).getByRole('button', { name: 'Remove step 2 (Light centre-out strokes)' }));
    expect(steps(panel)).toHaveLength(6);
    await userEvent.click(within(panel).getByRole('button', { name: 'Save as version 4' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    const sent = calls.find((c) => c.method === 'PUT')!.body as { steps: { kind: string; seconds: number }[] };
    expect(sent.steps.at(-1)).toEqual({ kind: 'passive-movement', seconds: 180, optional: false });
    expect(sent.steps.map((s) => s.kind)).not.toContain('light-strokes');
  });

  it('leaves massage out of the kinds an acute sequence can add', async () => {
    sequenceServer();
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await screen.findByRole('tabpanel', { name: /Acute/ });
    const options = within(within(panel).getByLabelText('Kind of step to add')).getAllByRole('option').map((o) => o.getAttribute('value'));
    expect(options).toContain('cold-pack');
    expect(options).not.toContain('cross-fibre-friction');
    expect(options).not.toContain('light-strokes');
  });

  it("puts the server's 400 field error on the step it names", async () => {
    sequenceServer(() => ({ status: 400, body: { error: { code: 'validation', message: 'Check the sequence', fields: { 'steps.1.seconds': 'Light centre-out strokes must last between 60 and 600 seconds (1–10 min)' } } } }));
    renderAt(<SequenceEditor canEdit />, '/sequences');
    const panel = await proliferative();
    await userEvent.click(within(steps(panel)[5]).getByLabelText('Optional'));
    await userEvent.click(within(panel).getByRole('button', { name: 'Save as version 4' }));
    expect(await within(steps(panel)[1]).findByText('Light centre-out strokes must last between 60 and 600 seconds (1–10 min)')).toBeInTheDocument();
    expect(within(steps(panel)[0]).queryByRole('alert')).toBeNull();
    expect(within(panel).getByText('Check the sequence')).toBeInTheDocument();
  });

  it('lets a therapist read the sequences without any control to change them', async () => {
    sequenceServer();
    renderAt(<SequenceEditor canEdit={false} />, '/sequences?phase=remodelling');
    const panel = await screen.findByRole('tabpanel', { name: /Remodelling/ });
    expect(within(panel).getByText('2. Cross-fibre friction')).toBeInTheDocument();
    expect(within(panel).queryByRole('textbox')).toBeNull();
    expect(within(panel).queryByRole('button')).toBeNull();
    expect(screen.getByText(/Only a supervisor can change/)).toBeInTheDocument();
  });
});
