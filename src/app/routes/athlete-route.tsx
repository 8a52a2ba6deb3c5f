import { useEffect, useRef, useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { ArrowLeft, Plus } from 'lucide-react';
import { Button } from '../../components/ui/button';
import { ApiError } from '../../lib/api-client';
import { useAthlete } from '../../features/athletes/api/get-athlete';
import { athleteKeys } from '../../features/athletes/api/keys';
import { AthleteProfile } from '../../features/athletes/components/athlete-profile';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { InjuryList } from '../../features/injuries/components/injury-list';
import { ConsentForms } from '../../features/uploads/components/consent-forms';
import { RecordInjuryForm } from '../../features/injuries/components/record-injury-form';
import { AppShell } from '../layout/app-shell';

function AthletePage({ athleteId }: { athleteId: string }) {
  const detail = useAthlete(athleteId);
  const [recording, setRecording] = useState(false);
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const recordSection = useRef<HTMLElement>(null);

  // The form opens below the fold on a landscape tablet; bring it up so the map is in view.
  useEffect(() => {
    if (recording) recordSection.current?.scrollIntoView?.({ block: 'start' });
  }, [recording]);

  if (detail.isPending) return <p className="text-ink-muted">Loading the athlete…</p>;
  if (detail.isError) {
    const notFound = detail.error instanceof ApiError && (detail.error.status === 404 || detail.error.status === 400);
    return (
      <div>
        <h1 className="text-2xl font-semibold">{notFound ? 'Athlete not found' : 'Could not load the athlete'}</h1>
        <p className="mt-2 text-ink-muted">{notFound ? 'They may belong to another clinic, or the link is wrong.' : detail.error.message}</p>
      </div>
    );
  }
  const { athlete, injuries } = detail.data;

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <Link to="/athletes" className="inline-flex min-h-target items-center gap-1 self-start font-medium underline underline-offset-4">
          <ArrowLeft aria-hidden className="h-4 w-4" /> Athletes
        </Link>
        <h1 className="text-2xl font-semibold">{athlete.name}</h1>
        <p className="text-ink-soft">
          Born {athlete.yearOfBirth} · {athlete.sport}
          {athlete.position ? ` · ${athlete.position}` : ''}
        </p>
      </header>
      <div className="grid items-start gap-4 lg:grid-cols-2">
        <div className="flex flex-col gap-4">
          <AthleteProfile athlete={athlete} />
          <ConsentForms athleteId={athlete.id} readOnly={Boolean(athlete.erasedAt)} />
        </div>
        <section aria-labelledby="injuries-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="injuries-heading" className="text-lg font-semibold">
              Injuries
            </h2>
            {recording || athlete.erasedAt ? null : (
              <Button onClick={() => setRecording(true)}>
                <Plus aria-hidden className="h-4 w-4" /> Record an injury
              </Button>
            )}
          </div>
          <InjuryList injuries={injuries} />
        </section>
      </div>
      {recording ? (
        <section ref={recordSection} aria-labelledby="record-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-2 ring-ink/20">
          <h2 id="record-heading" className="text-lg font-semibold">
            Record an injury
          </h2>
          <RecordInjuryForm
            athleteId={athlete.id}
            onCancel={() => setRecording(false)}
            onRecorded={(injury) => {
              void queryClient.invalidateQueries({ queryKey: athleteKeys.detail(athlete.id) });
              navigate(`/injuries/${injury.id}`);
            }}
          />
        </section>
      ) : null}
    </div>
  );
}

export function AthleteRoute() {
  const { id = '' } = useParams();
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <AthletePage athleteId={id} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
