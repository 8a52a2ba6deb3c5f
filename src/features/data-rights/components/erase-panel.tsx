import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CheckCircle2, ShieldAlert, Trash2 } from 'lucide-react';
import {
  eraseAthleteSchema,
  erasureConsequences,
  erasureKeeps,
  erasureRemoves,
  sameName,
  type DataRightsAthlete,
  type EraseAthleteInput,
  type ErasureResult,
} from '../../../../shared/data-rights/data-rights';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useEraseAthlete } from '../api/erase-athlete';
import { counted } from './counted';

/** Erasure asks for the name typed again and says, before and after, what goes and what stays. */
export function ErasePanel({ athlete, onClose }: { athlete: DataRightsAthlete; onClose: () => void }) {
  const erase = useEraseAthlete();
  const panel = useRef<HTMLElement>(null);
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors },
  } = useForm<EraseAthleteInput>({ resolver: zodResolver(eraseAthleteSchema), defaultValues: { confirmName: '' } });
  const typed = watch('confirmName');
  const matches = sameName(typed ?? '', athlete.name);

  // The panel opens below the list: bring it into view. (A block body: newer browsers return a promise here.)
  useEffect(() => {
    panel.current?.scrollIntoView?.({ block: 'start' });
  }, []);

  const submit = handleSubmit((body) =>
    erase.mutate(
      { id: athlete.id, body },
      {
        onError: (error) => {
          if (error instanceof ApiError && error.fields?.confirmName) setError('confirmName', { message: error.fields.confirmName });
        },
      },
    ),
  );

  if (erase.isSuccess) return <Erased result={erase.data} name={athlete.name} onClose={onClose} />;

  const serverError = erase.error && !(erase.error instanceof ApiError && erase.error.fields) ? erase.error.message : null;

  return (
    <section ref={panel} aria-labelledby="erase-heading" className="flex flex-col gap-4 rounded-xl border-l-4 border-ember-600 bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="erase-heading" className="flex items-center gap-2 text-lg font-semibold">
        <ShieldAlert aria-hidden className="h-5 w-5" /> Erase the personal data of {athlete.name}
      </h2>
      <Notice kind="caution" title="Cannot be undone">
        <ul className="list-disc pl-5">
          {erasureConsequences.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </Notice>
      <div className="grid gap-4 md:grid-cols-2">
        <div>
          <h3 className="font-semibold">Removed</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-sm" aria-label="What erasure removes">
            {erasureRemoves.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </div>
        <div>
          <h3 className="font-semibold">Kept</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-sm" aria-label="What erasure keeps">
            {erasureKeeps.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
          <p className="mt-2 text-sm text-ink-muted">
            Now on file:{' '}
            {[
              counted(athlete.counts.injuries, 'injury', 'injuries'),
              counted(athlete.counts.measurements, 'measurement'),
              counted(athlete.counts.runs, 'run'),
              counted(athlete.counts.files, 'file'),
              counted(athlete.counts.emails, 'e-mail'),
            ].join(', ')}
            .
          </p>
        </div>
      </div>
      {serverError ? (
        <Notice kind="error" title="Not erased">
          {serverError}
        </Notice>
      ) : null}
      <form onSubmit={submit} noValidate aria-label="Confirm the erasure" className="flex flex-col gap-3">
        <TextField
          label={`Type the athlete’s name to confirm: ${athlete.name}`}
          autoComplete="off"
          spellCheck={false}
          error={errors.confirmName?.message}
          {...register('confirmName')}
        />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="danger" disabled={!matches || erase.isPending}>
            <Trash2 aria-hidden className="h-4 w-4" />
            {erase.isPending ? 'Erasing…' : 'Erase personal data'}
          </Button>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
        </div>
      </form>
    </section>
  );
}

function Erased({ result, name, onClose }: { result: ErasureResult; name: string; onClose: () => void }) {
  const { removed } = result;
  return (
    <section aria-labelledby="erased-heading" className="flex flex-col gap-3 rounded-xl border-l-4 border-moss-500 bg-moss-50 p-4">
      <h2 id="erased-heading" role="status" className="flex items-center gap-2 text-lg font-semibold">
        <CheckCircle2 aria-hidden className="h-5 w-5" /> Personal data of {name} erased
      </h2>
      <p>The record is now &ldquo;{result.athlete.name}&rdquo;. The erasure is on the audit trail.</p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm">
        <dt className="font-semibold">Removed</dt>
        <dd>
          {[
            counted(removed.files, 'file'),
            `${counted(removed.cancelledEmails, 'queued e-mail')} cancelled`,
            `${counted(removed.redactedEmails, 'e-mail')} emptied of wording`,
            `${counted(removed.mailboxCopies, 'mailbox copy', 'mailbox copies')} deleted`,
          ].join('; ')}
        </dd>
        <dt className="font-semibold">Closed</dt>
        <dd>{counted(result.closedInjuries, 'open injury', 'open injuries')}</dd>
        <dt className="font-semibold">Kept</dt>
        <dd>
          {[
            counted(result.athlete.counts.injuries, 'injury', 'injuries'),
            counted(result.athlete.counts.measurements, 'measurement'),
            counted(result.athlete.counts.runs, 'run'),
            counted(result.athlete.counts.sessionNotes, 'session note'),
          ].join(', ')}
        </dd>
      </dl>
      <Button variant="secondary" className="self-start" onClick={onClose}>
        Done
      </Button>
    </section>
  );
}
