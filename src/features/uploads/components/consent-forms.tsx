import type { FormEvent } from 'react';
import { CheckCircle2, Download, FileText, FileUp } from 'lucide-react';
import { uploadRules } from '../../../../shared/uploads/uploads';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useConsentForms } from '../api/get-consent-forms';
import { useUploadConsentForm } from '../api/upload-consent-form';
import { FileField, useChosenFile } from './file-field';
import { takenWhen } from './format';

const rule = uploadRules['consent-form'];
const megabytes = rule.maxBytes / 1024 / 1024;
const size = (bytes: number) => (bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`);

/** The athlete's signed consent forms (PDF): the newest first, each downloadable, and a form to add a scan. */
export function ConsentForms({ athleteId, readOnly = false }: { athleteId: string; readOnly?: boolean }) {
  const forms = useConsentForms(athleteId);
  const upload = useUploadConsentForm(athleteId);
  const chosenFile = useChosenFile('consent-form', upload);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (chosenFile.ready) upload.mutate(chosenFile.ready, { onSuccess: chosenFile.clear });
  };


  return (
    <section aria-labelledby="consent-forms-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="consent-forms-heading" className="text-lg font-semibold">
        Signed consent forms
      </h2>
      {forms.isPending ? <p className="text-ink-muted">Loading the forms…</p> : null}
      {forms.isError ? <p className="text-ember-700">{forms.error.message}</p> : null}
      {forms.data && forms.data.length === 0 ? <p className="text-ink-muted">No signed form on file yet.</p> : null}
      {forms.data && forms.data.length > 0 ? (
        <ul className="flex flex-col divide-y divide-ink/10" aria-label="Signed consent forms on file">
          {forms.data.map((form) => (
            <li key={form.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span className="flex min-w-0 items-start gap-2">
                <FileText aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
                <span className="min-w-0">
                  <span className="block truncate font-medium">{form.originalName ?? 'Consent form (PDF)'}</span>
                  <span className="block text-sm text-ink-muted">
                    {takenWhen(form.uploadedAt)}
                    {form.uploadedByName ? ` · added by ${form.uploadedByName}` : ''} · {size(form.byteSize)}
                  </span>
                </span>
              </span>
              <a
                href={form.url}
                download
                className="inline-flex min-h-target items-center gap-2 rounded-lg border border-ink/25 px-4 py-2 font-medium hover:bg-paper-sunk"
                aria-label={`Download ${form.originalName ?? 'the consent form'}`}
              >
                <Download aria-hidden className="h-4 w-4" /> Download
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      {readOnly ? null : (
        <form onSubmit={submit} className="flex flex-col gap-3" aria-label="Add a signed consent form">
          <div className="flex flex-wrap items-end gap-3">
            <div className="flex-1">
              <FileField
                ref={chosenFile.input}
                label={
                  <>
                    Signed consent form (PDF) <span className="font-normal text-ink-muted">(up to {megabytes} MB)</span>
                  </>
                }
                accept={rule.accepted}
                invalid={Boolean(chosenFile.error)}
                onPick={chosenFile.pick}
              />
            </div>
            <Button type="submit" disabled={!chosenFile.ready || upload.isPending}>
              <FileUp aria-hidden className="h-4 w-4" />
              {upload.isPending ? 'Uploading…' : 'Add form'}
            </Button>
          </div>
          {chosenFile.error ? (
            <Notice kind="error" title="Form not added">
              {chosenFile.error}
            </Notice>
          ) : null}
          {upload.isSuccess ? (
            <p role="status" className="flex items-center gap-2 text-sm font-medium text-moss-700">
              <CheckCircle2 aria-hidden className="h-4 w-4" /> Consent form added.
            </p>
          ) : null}
        </form>
      )}
    </section>
  );
}
