import { screen, waitFor } from '@testing-library/react';
import { buildPlan } from '../../../shared/plan/build-plan';
import { defaultSequences } from '../../../shared/plan/sequence';
import type { RunDetailView } from '../../../shared/runs/responses';
import { clinicalCaution } from '../../../shared/safety/caution';
import { TableModeScreen } from '../../../src/features/table-mode/components/table-mode-screen';
import { renderWithProviders } from '../records/harness';

const plan = buildPlan({ phase: 'acute', sequence: defaultSequences.acute, tolerance: 'usual', coldContraindicated: false, suspectedMyositis: false });

const detail: RunDetailView = {
  run: {
    id: '00000000-0000-4000-8000-000000000101',
    injuryId: '00000000-0000-4000-8000-000000000102',
    athleteId: '00000000-0000-4000-8000-000000000103',
    athleteName: 'Rowan Test',
    injuryLabel: 'left anterior thigh',
    therapistId: '00000000-0000-4000-8000-000000000104',
    therapistName: 'Therapist Test',
    phase: 'acute',
    status: 'ready',
    outcome: null,
    plan,
    sequenceVersion: 1,
    screening: null,
    screeningOutcome: null,
    startedAt: null,
    endedAt: null,
    createdAt: new Date().toISOString(),
  },
  entries: [],
};

describe('table mode shows the clinical caution', () => {
  it('the caution names clinical judgement, a physician, local regulations and licensed scope', () => {
    expect(clinicalCaution).toBe(
      "Mendstep supports, and does not replace, clinical judgement, a physician's advice, local regulations and the therapist's licensed scope of practice.",
    );
  });

  it('the caution line is on the table-mode screen', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response('{}', { status: 200 })));
    renderWithProviders(<TableModeScreen detail={detail} onSessionExpired={() => {}} />);
    // Let the run's actor settle (this jsdom has no IndexedDB, so it reports that) before looking.
    await waitFor(() => expect(screen.queryByText('Loading the run…')).not.toBeInTheDocument());
    expect(screen.getByTestId('clinical-caution')).toHaveTextContent(clinicalCaution);
  });
});
