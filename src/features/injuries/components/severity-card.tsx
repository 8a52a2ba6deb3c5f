import { Gauge } from 'lucide-react';
import { isAnteriorThighRegion, type BodyRegionId } from '../../../../shared/records/body-map';
import type { InjuryView } from '../../../../shared/records/responses';
import { Notice } from '../../../components/ui/notice';
import { Card, Source } from './card';

const gradeWord = { mild: 'Mild', moderate: 'Moderate', severe: 'Severe' } as const;

export function SeverityCard({ injury }: { injury: InjuryView }) {
  const { severity } = injury;
  const timeLost = injury.assessment.timeLost;
  const gradable = isAnteriorThighRegion(injury.region as BodyRegionId);

  return (
    <Card title="Severity" icon={Gauge}>
      {severity ? (
        <>
          <p className="text-2xl font-semibold" data-testid="severity-grade">
            {gradeWord[severity.grade]}
            <span className="ml-2 text-base font-normal text-ink-muted">from {severity.kneeFlexionDeg}° active knee flexion</span>
          </p>
          <Source>{severity.source}</Source>
          {severity.timingWarning ? (
            <Notice kind="caution" title="Timing">
              {severity.timingWarning}
            </Notice>
          ) : null}
          {timeLost ? (
            <div className="rounded-lg bg-paper-sunk p-3">
              <p className="text-sm font-semibold">Published mean time lost</p>
              <p className="text-sm">{timeLost.wording}</p>
            </div>
          ) : null}
        </>
      ) : gradable ? (
        <p>
          Not graded yet. Record active knee flexion, ideally 12–48 hours after the injury, to grade it: mild over 90°, moderate 45°–90°,
          severe under 45° (Ryan et al. 1991).
        </p>
      ) : (
        <p>Not graded: the published knee-flexion grading (Ryan et al. 1991) is for anterior-thigh (quadriceps) contusions only.</p>
      )}
    </Card>
  );
}
