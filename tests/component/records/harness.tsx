import type { ReactNode } from 'react';
import { render } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { vi } from 'vitest';
import { assessInjury, type InjuryForAssessment, type MeasurementForAssessment } from '../../../shared/clinical/assess-injury';
import { defaultClinicSettings } from '../../../shared/clinic/settings';
import { bodyRegionById, type BodyRegionId } from '../../../shared/records/body-map';
import type { InjuryView } from '../../../shared/records/responses';

export function renderWithProviders(ui: ReactNode, { route = '/' }: { route?: string } = {}) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <MemoryRouter initialEntries={[route]}>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
}

type Reply = { status?: number; body: unknown };
export type Route = (method: string, url: string, body: unknown) => Reply | undefined;

/** A fetch that answers the CSRF request itself and everything else from `route`, remembering each call. */
export function fakeServer(route: Route) {
  const calls: { method: string; url: string; body: unknown }[] = [];
  const fetchMock = vi.fn(async (url: string, init: RequestInit = {}) => {
    if (url === '/api/auth/csrf') return new Response(JSON.stringify({ token: 't' }), { status: 200 });
    const method = init.method ?? 'GET';
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push({ method, url, body });
    const reply = route(method, url, body) ?? { status: 404, body: { error: { code: 'not_found', message: 'Not found' } } };
    return new Response(JSON.stringify(reply.body), { status: reply.status ?? 200, headers: { 'Content-Type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return calls;
}

export const hoursAgo = (hours: number) => new Date(Date.now() - hours * 3_600_000).toISOString();

let nextId = 1;
const uuid = () => `00000000-0000-4000-8000-${String(nextId++).padStart(12, '0')}`;

/** An injury as the API sends it, with its computed fields worked out by the same shared code the server uses. */
export function makeInjury(
  options: {
    region?: BodyRegionId;
    side?: 'left' | 'right';
    athleteName?: string;
    sport?: string;
    injuredHoursAgo?: number;
    measurements?: MeasurementForAssessment[];
    phaseOverride?: InjuryForAssessment['phaseOverride'];
    remeasureDue?: boolean;
  } = {},
): InjuryView {
  const region = options.region ?? 'anterior-thigh';
  const injuredAt = hoursAgo(options.injuredHoursAgo ?? 20);
  const measurements = options.measurements ?? [];
  const assessment = assessInjury({
    injury: { region, injuredAt, previousQuadricepsInjury: false, kneeEffusion: false, phaseOverride: options.phaseOverride ?? null },
    athleteSport: options.sport ?? 'Football',
    measurements,
    settings: defaultClinicSettings,
    now: new Date().toISOString(),
  });
  const lastMeasuredAt = measurements.length ? String(measurements[measurements.length - 1].takenAt) : null;
  return {
    id: uuid(),
    athleteId: uuid(),
    athleteName: options.athleteName ?? 'Rowan Tesk',
    region,
    regionLabel: bodyRegionById(region).label,
    side: options.side ?? 'left',
    mechanismKind: 'knee-to-thigh',
    mechanism: null,
    injuredAt,
    haematomaType: 'not-known',
    previousQuadricepsInjury: false,
    kneeEffusion: false,
    treatmentStartedAt: null,
    status: 'open',
    closedAt: null,
    phaseOverride: options.phaseOverride ? { ...options.phaseOverride, at: hoursAgo(1), byName: 'Tamsin Ruel' } : null,
    severity: assessment.severity,
    suggestedPhase: assessment.suggestedPhase,
    phase: assessment.phase,
    phaseReason: assessment.phaseReason,
    phaseIsOverride: assessment.phaseIsOverride,
    risks: assessment.risks,
    assessment,
    lastMeasuredAt,
    remeasureDue: options.remeasureDue ?? lastMeasuredAt === null,
  };
}
