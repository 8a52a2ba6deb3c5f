import { X } from 'lucide-react';
import { phases } from '../../../../shared/phase';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useReviewFilters } from '../api/get-review-filters';
import { reviewOutcomes } from '../../../../shared/review/query';
import { filterKeys, type ReviewRunsQuery } from '../lib/review-query';
import { outcomeWords } from './status-badges';
import { FilterSelect } from '../../../components/ui/filter-select';

type Change = (next: Partial<ReviewRunsQuery>) => void;

/** Every change applies at once and goes back to page 1: the address bar is the single place the filters live. */
export function ReviewFilters({ query, onChange }: { query: ReviewRunsQuery; onChange: Change }) {
  const options = useReviewFilters();
  const anyFilter = filterKeys.some((key) => query[key] !== undefined);

  return (
    <form role="search" aria-label="Filter runs" className="grid gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10 sm:grid-cols-3 lg:grid-cols-6" onSubmit={(e) => e.preventDefault()}>
      <TextField label="From" type="date" value={query.from ?? ''} max={query.to} onChange={(e) => onChange({ from: e.target.value || undefined })} />
      <TextField label="To" type="date" value={query.to ?? ''} min={query.from} onChange={(e) => onChange({ to: e.target.value || undefined })} />
      <FilterSelect label="Therapist" value={query.therapistId} onChange={(therapistId) => onChange({ therapistId })}>
        <option value="">All therapists</option>
        {options.data?.therapists.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name}
          </option>
        ))}
      </FilterSelect>
      <FilterSelect label="Athlete" value={query.athleteId} onChange={(athleteId) => onChange({ athleteId })}>
        <option value="">All athletes</option>
        {options.data?.athletes.map((a) => (
          <option key={a.id} value={a.id}>
            {a.name}
          </option>
        ))}
      </FilterSelect>
      <FilterSelect label="Phase" value={query.phase} onChange={(phase) => onChange({ phase: phase as ReviewRunsQuery['phase'] })}>
        <option value="">All phases</option>
        {phases.map((p) => (
          <option key={p} value={p} className="capitalize">
            {p.charAt(0).toUpperCase() + p.slice(1)}
          </option>
        ))}
      </FilterSelect>
      <FilterSelect label="Outcome" value={query.outcome} onChange={(outcome) => onChange({ outcome: outcome as ReviewRunsQuery['outcome'] })}>
        <option value="">All outcomes</option>
        {reviewOutcomes.map((o) => (
          <option key={o} value={o}>
            {outcomeWords[o]}
          </option>
        ))}
      </FilterSelect>
      <FilterSelect label="Session note" value={query.noteSigned} onChange={(noteSigned) => onChange({ noteSigned: noteSigned as ReviewRunsQuery['noteSigned'] })}>
        <option value="">Signed or not</option>
        <option value="true">Signed</option>
        <option value="false">Not signed yet</option>
      </FilterSelect>
      <label className="inline-flex min-h-target cursor-pointer items-center gap-3 self-end rounded-lg px-1 font-medium sm:col-span-2">
        <input type="checkbox" className="h-6 w-6 accent-ink" checked={query.attention === 'true'} onChange={(e) => onChange({ attention: e.target.checked ? 'true' : undefined })} />
        Needs attention only
      </label>
      <div className="flex items-end">
        <Button variant="ghost" disabled={!anyFilter} onClick={() => onChange(Object.fromEntries(filterKeys.map((key) => [key, undefined])))}>
          <X aria-hidden className="h-4 w-4" /> Clear filters
        </Button>
      </div>
    </form>
  );
}
