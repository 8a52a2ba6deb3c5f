import { useParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { InjuryDetail } from '../../features/injuries/components/injury-detail';
import { useInjury } from '../../features/injuries/api/get-injury';
import { InjuryPhotos } from '../../features/uploads/components/injury-photos';
import { ClosurePanel } from '../../features/closure/components/closure-panel';
import { RecheckEditor } from '../../features/closure/components/recheck-editor';
import { EmailOptOutNote } from '../../features/athletes/components/email-status';
import { RunsInProgress } from '../../features/runs/components/runs-in-progress';
import { AppShell } from '../layout/app-shell';

export function InjuryRoute() {
  const { id = '' } = useParams();
  return (
    <RequireAuth roles={['therapist', 'supervisor']}>
      {(user) => (
        <AppShell user={user}>
          <InjuryDetail injuryId={id} operations={<InjuryOperations injuryId={id} />} />
          <InjuryPhotosPanel injuryId={id} />
        </AppShell>
      )}
    </RequireAuth>
  );
}

/** Bruise photos under the injury's cards, keyed to its measurements (the same query as the page, no second fetch). */
function InjuryPhotosPanel({ injuryId }: { injuryId: string }) {
  const detail = useInjury(injuryId);
  if (!detail.data) return null;
  return (
    <div className="mt-6">
      <InjuryPhotos injuryId={injuryId} measurements={detail.data.measurements} />
    </div>
  );
}

/** The next re-check and the return-to-activity check, beside each other under the page's header. */
function InjuryOperations({ injuryId }: { injuryId: string }) {
  const detail = useInjury(injuryId);
  if (!detail.data) return null;
  const { injury, athlete } = detail.data;
  return (
    <div className="grid items-start gap-4 lg:grid-cols-[1fr_2fr]">
      <div className="lg:col-span-2">
        <RunsInProgress injuryId={injuryId} />
      </div>
      {athlete.emailOptedOutAt ? (
        // The home-care plan cannot go by e-mail: the therapist must hand it over in person.
        <p className="rounded-lg bg-ember-50 px-3 py-2 text-sm lg:col-span-2">
          <EmailOptOutNote athlete={athlete} />
        </p>
      ) : null}
      {injury.status === 'open' ? <RecheckEditor key={injury.nextRecheckAt ?? 'none'} injury={injury} /> : null}
      <div className={injury.status === 'open' ? '' : 'lg:col-span-2'}>
        <ClosurePanel injuryId={injuryId} />
      </div>
    </div>
  );
}
