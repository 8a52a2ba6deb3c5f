import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { BadgeCheck } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useSignOffNote } from '../api/sign-off-note';
import { signOffSchema, type SignOff } from '../../../../shared/notes/schemas';
import type { NoteMutationOptions } from '../api/use-note-mutation';
import { placeServerError } from '../lib/server-errors';
import { NoteArea } from './note-parts';

/** The supervisor's sign-off of a submitted note; an empty comment is sent as none. */
export function SignOffForm({ runId, onChanged }: { runId: string } & NoteMutationOptions) {
  const signOff = useSignOffNote(runId, { onChanged });
  const { register, handleSubmit, setError, formState } = useForm<SignOff>({ resolver: zodResolver(signOffSchema), defaultValues: { comment: '' } });
  const { errors } = formState;
  const onSubmit = handleSubmit((values) =>
    signOff.mutateAsync(values.comment ? { comment: values.comment } : {}).catch((error) => placeServerError(error, ['comment'], setError)),
  );
  return (
    <form noValidate aria-label="Sign off the note" className="flex flex-col gap-3 border-t border-ink/10 pt-3" onSubmit={onSubmit}>
      {errors.root?.server ? (
        <Notice kind="error" title="Not signed">
          {errors.root.server.message}
        </Notice>
      ) : null}
      <NoteArea label="Sign-off comment (optional)" hint="Seen by the therapist beside the locked note" rows={3} error={errors.comment?.message} {...register('comment')} />
      <Button type="submit" disabled={signOff.isPending} className="self-start">
        <BadgeCheck aria-hidden className="h-5 w-5" /> {signOff.isPending ? 'Signing…' : 'Sign off the note'}
      </Button>
      <p className="text-sm text-ink-muted">Signing locks the note. You can reopen it later, giving a reason.</p>
    </form>
  );
}
