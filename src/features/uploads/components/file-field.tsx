import { forwardRef, useId, useRef, useState, type ReactNode } from 'react';
import { uploadRules, type UploadKind } from '../../../../shared/uploads/uploads';
import { ApiError } from '../../../lib/api-client';

/** A labelled file picker as the upload forms show it, a touch target tall; hands back the one file chosen (or none). */
export const FileField = forwardRef<HTMLInputElement, { label: ReactNode; accept: readonly string[]; invalid: boolean; onPick: (file: File | null) => void }>(
  function FileField({ label, accept, invalid, onPick }, ref) {
    const id = useId();
    return (
      <div className="flex min-w-0 flex-col gap-1">
        <label htmlFor={id} className="text-sm font-medium">
          {label}
        </label>
        <input
          ref={ref}
          id={id}
          type="file"
          accept={accept.join(',')}
          aria-invalid={invalid ? true : undefined}
          onChange={(e) => onPick(e.target.files?.[0] ?? null)}
          className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2 file:mr-3 file:min-h-[36px] file:rounded-md file:border-0 file:bg-paper-sunk file:px-3 file:font-medium"
        />
      </div>
    );
  },
);

/**
 * The file an upload form is about to send: too large is said before anything is sent (the server checks again),
 * and the server's refusal names what to change.
 */
export function useChosenFile(kind: UploadKind, upload: { reset: () => void; error: Error | null }) {
  const rule = uploadRules[kind];
  const [file, setFile] = useState<File | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const tooBig = Boolean(file && file.size > rule.maxBytes);
  const error = tooBig
    ? `The ${rule.noun} is larger than ${rule.maxBytes / 1024 / 1024} MB. Choose a smaller one.`
    : upload.error instanceof ApiError
      ? (upload.error.fields?.file ?? upload.error.message)
      : upload.error
        ? 'Could not reach Mendstep. Try again.'
        : null;
  return {
    rule,
    input,
    /** The file to send, when there is one that may be sent. */
    ready: tooBig ? null : file,
    error,
    pick(next: File | null) {
      upload.reset();
      setFile(next);
    },
    clear() {
      setFile(null);
      if (input.current) input.current.value = '';
    },
  };
}
