import { useSearchParams } from 'react-router-dom';
import { parseReviewQuery, toSearchParams, type ReviewRunsQuery } from '../lib/review-query';
import { AdherencePanel } from './adherence-panel';
import { ReviewFilters } from './review-filters';
import { RunsTable } from './runs-table';

/** The supervisor's home: filters, the runs table and adherence, all driven by the address bar. */
export function ReviewDesk() {
  const [params, setParams] = useSearchParams();
  const query = parseReviewQuery(params);
  // Any new filter or sort starts again at page 1; only the pager keeps the page it asks for.
  const change = (next: Partial<ReviewRunsQuery>, keepPage = false) =>
    setParams(toSearchParams({ ...query, ...(keepPage ? {} : { page: 1 }), ...next }), { replace: true });

  return (
    <div className="flex flex-col gap-6">
      <ReviewFilters query={query} onChange={change} />
      <RunsTable query={query} onChange={change} />
      <AdherencePanel from={query.from} to={query.to} />
    </div>
  );
}
