import { useId, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ArrowLeft, OctagonAlert, Printer } from 'lucide-react';
import type { ReferralSummary } from '../../../../shared/clinic/referral';
import { ApiError } from '../../../lib/api-client';
import { useReferral } from '../api/get-referral';
import { CautionLine } from '../../../components/ui/caution-line';
import './referral-print.css';

const phaseWords = { acute: 'Acute', proliferative: 'Proliferative', remodelling: 'Remodelling' } as const;
const gradeWords: Record<string, string> = { mild: 'Mild', moderate: 'Moderate', severe: 'Severe' };
const haematomaWords: Record<string, string> = { intramuscular: 'intramuscular', intermuscular: 'intermuscular', 'not-known': 'type not known yet' };
const roleWords: Record<string, string> = { therapist: 'sports massage therapist', supervisor: 'supervising therapist', admin: 'clinic admin' };

export function ReferralPage({ injuryId, runId }: { injuryId: string; runId: string | null }) {
  const referral = useReferral(injuryId, runId);
  if (referral.isPending) return <p className="p-6 text-ink-muted">Preparing the referral summary…</p>;
  if (referral.isError) {
    const notFound = referral.error instanceof ApiError && (referral.error.status === 404 || referral.error.status === 400);
    return (
      <main className="p-6">
        <h1 className="text-2xl font-semibold">{notFound ? 'Injury not found' : 'Could not prepare the summary'}</h1>
        <p className="mt-2 text-ink-muted">{notFound ? 'It may belong to another clinic, or the link is wrong.' : referral.error.message}</p>
      </main>
    );
  }
  return <ReferralSheet referral={referral.data} />;
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="mt-4" aria-label={title}>
      <h2 className="mb-1 border-b border-black/30 pb-0.5 text-base font-semibold uppercase tracking-wide">{title}</h2>
      {children}
    </section>
  );
}

function Pair({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="font-medium text-black/70">{label}</dt>
      <dd>{children}</dd>
    </>
  );
}

export function ReferralSheet({ referral }: { referral: ReferralSummary }) {
  const [note, setNote] = useState('');
  const noteId = useId();
  const { athlete, injury, clinic } = referral;
  const zone = referral.timeZone;
  const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: zone });
  const date = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', timeZone: zone });
  const contact = [clinic.contactPhone, clinic.contactEmail].filter(Boolean).join(' · ');
  const hasRedFlag = referral.reasons.some((r) => r.kind === 'red-flag' || r.kind === 'stop-elevate-refer');

  return (
    <div className="min-h-screen bg-paper-sunk py-6 print:bg-white print:py-0">
      <div className="referral-no-print mx-auto mb-4 flex max-w-[210mm] flex-wrap items-center justify-between gap-3 px-2">
        <Link to={`/injuries/${injury.id}`} className="inline-flex min-h-target items-center gap-1 font-medium underline underline-offset-4">
          <ArrowLeft aria-hidden className="h-4 w-4" /> Back to the injury
        </Link>
        <button
          type="button"
          onClick={() => window.print()}
          className="inline-flex min-h-target items-center gap-2 rounded-lg bg-ink px-4 py-2 font-medium text-paper hover:bg-ink-soft"
        >
          <Printer aria-hidden className="h-4 w-4" /> Print or save as PDF
        </button>
      </div>

      <article className="referral-sheet mx-auto max-w-[210mm] bg-white p-[14mm] text-sm text-black shadow-lg" aria-label="Referral summary">
        <header className="flex flex-wrap items-start justify-between gap-4 border-b-2 border-black pb-2">
          <div>
            <h1 className="text-2xl font-bold">Referral summary for a physician</h1>
            <p>
              {athlete.name} · {injury.site}, {injury.side}
            </p>
          </div>
          <div className="text-right">
            <p className="font-semibold">{clinic.name}</p>
            {contact ? <p>{contact}</p> : null}
            <p>Prepared {dateTime.format(new Date(referral.generatedAt))}</p>
          </div>
        </header>

        <section
          aria-label="Reason for referral"
          className={`referral-reasons mt-3 rounded border-2 p-2 ${hasRedFlag ? 'border-ember-700 bg-ember-50' : 'border-black/40'}`}
        >
          <h2 className="flex items-center gap-2 text-base font-bold">
            <OctagonAlert aria-hidden className="h-5 w-5" /> Reason for referral
          </h2>
          {referral.reasons.length ? (
            <ul className="ml-5 list-disc" data-testid="referral-reasons">
              {referral.reasons.map((reason, i) => (
                <li key={i}>
                  <strong>{reason.text}</strong>
                  {reason.at ? ` (${dateTime.format(new Date(reason.at))})` : ''}
                </li>
              ))}
            </ul>
          ) : (
            <p>No red flag is recorded in Mendstep for this injury.</p>
          )}
          <div className="referral-no-print mt-2 flex flex-col gap-1">
            <label htmlFor={noteId} className="text-sm font-medium">
              The therapist&rsquo;s note to the physician (printed, not saved)
            </label>
            <textarea id={noteId} rows={2} value={note} onChange={(e) => setNote(e.target.value)} className="min-h-target rounded border border-black/40 px-2 py-1" />
          </div>
          {/* On paper: the note as typed, or a line to write the reason by hand. */}
          <p className="referral-print-only mt-1 hidden whitespace-pre-line">
            {note.trim() ? `Therapist's note: ${note.trim()}` : "Therapist's reason: ______________________________________________"}
          </p>
        </section>

        <div className="grid grid-cols-2 gap-x-6">
          <Section title="Athlete">
            <dl className="grid grid-cols-[auto_1fr] gap-x-3">
              <Pair label="Name">{athlete.name}</Pair>
              <Pair label="Born">
                {athlete.yearOfBirth} (turns {athlete.ageThisYear} this year)
              </Pair>
              <Pair label="Sport">
                {athlete.sport}
                {athlete.position ? `, ${athlete.position}` : ''}
              </Pair>
            </dl>
          </Section>
          <Section title="Injury">
            <dl className="grid grid-cols-[auto_1fr] gap-x-3">
              <Pair label="Site">
                {injury.site}, {injury.side}
                {injury.reinjuryOfId ? ' (re-injury)' : ''}
              </Pair>
              <Pair label="Mechanism">{injury.mechanism}</Pair>
              <Pair label="When">
                {dateTime.format(new Date(injury.injuredAt))} (day {injury.daysSinceInjury})
              </Pair>
              <Pair label="Haematoma">{haematomaWords[injury.haematomaType] ?? injury.haematomaType}</Pair>
            </dl>
          </Section>
        </div>

        <Section title="Phase and severity">
          <p>
            <strong>{phaseWords[injury.phase]} phase.</strong> {injury.phaseReason}
          </p>
          <p>
            {injury.severity
              ? `Severity: ${gradeWords[injury.severity.grade] ?? injury.severity.grade}, ${injury.severity.kneeFlexionDeg}° active knee flexion (${injury.severity.source}).`
              : 'Severity: not graded (grading by knee flexion applies to anterior-thigh contusions).'}
          </p>
          {injury.myositisRiskFactors.length ? <p>Myositis ossificans risk factors present: {injury.myositisRiskFactors.join('; ')}.</p> : null}
        </Section>

        <Section title="Measurements over time">
          {referral.measurements.length ? (
            <table className="w-full border-collapse text-left">
              <thead>
                <tr className="border-b border-black/40">
                  <th className="py-0.5 pr-2 font-semibold">Taken</th>
                  <th className="py-0.5 pr-2 font-semibold">Girth injured / other (cm)</th>
                  <th className="py-0.5 pr-2 font-semibold">Knee flexion</th>
                  <th className="py-0.5 pr-2 font-semibold">Pain (NPRS)</th>
                  <th className="py-0.5 pr-2 font-semibold">Bruise (cm)</th>
                </tr>
              </thead>
              <tbody>
                {referral.measurements.map((m) => (
                  <tr key={m.id} className="border-b border-black/10">
                    <td className="py-0.5 pr-2">{date.format(new Date(m.takenAt))}</td>
                    <td className="py-0.5 pr-2">
                      {m.girthInjuredCm !== null && m.girthOtherCm !== null
                        ? `${m.girthInjuredCm} / ${m.girthOtherCm}${m.girthLandmark ? ` (${m.girthDistanceCm ?? '?'} cm from ${m.girthLandmark})` : ''}`
                        : '—'}
                    </td>
                    <td className="py-0.5 pr-2">{m.kneeFlexionDeg !== null ? `${m.kneeFlexionDeg}°` : '—'}</td>
                    <td className="py-0.5 pr-2">{m.painNprs !== null ? `${m.painNprs}/10` : '—'}</td>
                    <td className="py-0.5 pr-2">{m.bruiseLengthCm !== null && m.bruiseWidthCm !== null ? `${m.bruiseLengthCm} × ${m.bruiseWidthCm}` : '—'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p>No measurements recorded.</p>
          )}
          {referral.measurementsOmitted ? <p className="text-xs">{referral.measurementsOmitted} earlier measurements are left off this page.</p> : null}
        </Section>

        <Section title="What was done">
          {referral.runs.length ? (
            <ul className="flex flex-col gap-0.5">
              {referral.runs.map((run) => (
                <li key={run.id}>
                  <strong>{date.format(new Date(run.at))}</strong> · {phaseWords[run.phase]} · {run.therapistName} · {run.outcome}
                  {run.stepsDone.length ? `: ${run.stepsDone.join(', ')}` : ''}
                  {run.swellingChecks.length ? `. Swelling checks: ${run.swellingChecks.join(', ')}` : ''}
                </li>
              ))}
            </ul>
          ) : (
            <p>No treatment runs recorded.</p>
          )}
          {referral.runsOmitted ? <p className="text-xs">{referral.runsOmitted} earlier runs are left off this page.</p> : null}
        </Section>

        <footer className="mt-6 grid grid-cols-2 gap-6 border-t border-black/40 pt-2 text-xs">
          <p>
            Prepared by {referral.preparedBy.name}, {roleWords[referral.preparedBy.role] ?? referral.preparedBy.role}, {clinic.name}.
            <br />
            Signature: ______________________
          </p>
          <p>
            A sports massage therapist&rsquo;s record, not a diagnosis. Values graded from published sources are named with them; thresholds marked as the clinic&rsquo;s are its own
            settings.
          </p>
          <CautionLine className="col-span-2" />
        </footer>
      </article>
    </div>
  );
}
