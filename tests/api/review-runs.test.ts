import { randomUUID } from 'node:crypto';
import { DateTime } from 'luxon';
import { beforeAll, describe, expect, it } from 'vitest';
import { Run } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let supervisor: Agent;
let admin: Agent;
let therapistA: Agent;
let therapistB: Agent;
let otherSupervisor: Agent;
const clinicZone = 'Europe/London';

const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000);
const minutesAfter = (base: Date, m: number) => new Date(base.getTime() + m * 60_000).toISOString();
/** A calendar day in the clinic's zone, as the review filters take it. */
const dayAgo = (days: number) => DateTime.now().setZone(clinicZone).minus({ days }).toFormat('yyyy-MM-dd');

type Entry = Record<string, unknown>;

async function newInjury(agent: Agent, athleteName: string, days: number, measure = true) {
  const athlete = (await agent.post('/api/athletes').send({ consentToTreatment: true, name: athleteName, yearOfBirth: 1999, sport: 'Hockey' })).body.athlete;
  const injury = (await agent.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(days * 24).toISOString() })).body.injury;
  expect(injury?.id).toBeDefined();
  if (measure) {
    const m = await agent.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(4).toISOString(), painNprs: 4, bruiseLengthCm: 6, bruiseWidthCm: 4 });
    expect(m.status).toBe(201);
  }
  return { athlete, injury };
}

/** A finished run: started two and a half hours ago, each entry logged in order. */
async function finishedRun(agent: Agent, options: { athleteName: string; days: number; entries: (t0: Date) => Entry[]; screening?: object; createdDaysAgo?: number }) {
  const { athlete, injury } = await newInjury(agent, options.athleteName, options.days);
  const res = await agent.post('/api/runs').send({ injuryId: injury.id, screening: options.screening ?? clear });
  expect(res.status).toBe(201);
  const run = res.body.run;
  const t0 = hoursAgo(2.5);
  for (const [i, entry] of options.entries(t0).entries()) {
    const logged = await agent.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send({ seq: i + 1, ...entry });
    expect(logged.status, JSON.stringify(logged.body)).toBe(201);
  }
  if (options.createdDaysAgo !== undefined) {
    // Review filters read the run's creation time; the API always creates "now", so older runs are dated here.
    await Run.update({ createdAt: hoursAgo(options.createdDaysAgo * 24 + 2.6) }, { where: { id: run.id }, silent: true });
  }
  return { run, athlete, injury };
}

const done = (stepIndex: number | null, kind: string, planned: number, actual: number, at: string, extra: Entry = {}): Entry => ({
  type: 'step-completed',
  ...(stepIndex === null ? {} : { stepIndex }),
  kind,
  plannedSeconds: planned,
  actualSeconds: actual,
  at,
  ...extra,
});

const runs: Record<string, { id: string; athleteId: string; injuryId: string }> = {};
let therapistAId: string;
let therapistBId: string;

beforeAll(async () => {
  const clinic = await createClinic();
  const other = await createClinic();
  const ta = await createStaff(clinic.id, 'therapist', { name: 'Aoife Brennan' });
  const tb = await createStaff(clinic.id, 'therapist', { name: 'Bram Keller' });
  therapistAId = ta.id;
  therapistBId = tb.id;
  therapistA = await signedInAgent(app, ta.email);
  therapistB = await signedInAgent(app, tb.email);
  supervisor = await signedInAgent(app, (await createStaff(clinic.id, 'supervisor', { name: 'Sol Varga' })).email);
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
  otherSupervisor = await signedInAgent(app, (await createStaff(other.id, 'supervisor')).email);

  // Proliferative, everything done; the optional last ice massage skipped as the sequence allows.
  const completed = await finishedRun(therapistA, {
    athleteName: 'Ana Quill',
    days: 10,
    createdDaysAgo: 3,
    entries: (t0) => [
      done(0, 'ice-massage', 360, 360, minutesAfter(t0, 6)),
      done(1, 'light-strokes', 300, 300, minutesAfter(t0, 11)),
      done(2, 'passive-movement', 180, 180, minutesAfter(t0, 14)),
      done(3, 'active-movement', 180, 180, minutesAfter(t0, 17)),
      done(4, 'rest-recheck', 120, 110, minutesAfter(t0, 19)),
      { type: 'swelling-check', stepIndex: 4, kind: 'rest-recheck', detail: 'not increased', at: minutesAfter(t0, 19) },
      { type: 'step-skipped', stepIndex: 5, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 0, reason: 'area not sore', detail: 'optional step', at: minutesAfter(t0, 19) },
      { type: 'run-completed', at: minutesAfter(t0, 19) },
    ],
  });
  // Swelling increased during the strokes: back to cold.
  const fellBack = await finishedRun(therapistA, {
    athleteName: 'Bea Ortiz',
    days: 10,
    createdDaysAgo: 10,
    entries: (t0) => [
      done(0, 'ice-massage', 360, 360, minutesAfter(t0, 6)),
      { type: 'step-interrupted', stepIndex: 1, kind: 'light-strokes', plannedSeconds: 300, actualSeconds: 100, reason: 'swelling increased', at: minutesAfter(t0, 8) },
      { type: 'swelling-check', stepIndex: 1, kind: 'light-strokes', detail: 'increased', at: minutesAfter(t0, 8) },
      done(null, 'cold-pack', 1200, 1200, minutesAfter(t0, 28), { detail: 'back to cold' }),
      done(null, 'compression-wrap', 180, 170, minutesAfter(t0, 31), { detail: 'back to cold' }),
      { type: 'run-fell-back', reason: 'swelling increased', detail: 'back to cold after light centre-out strokes', at: minutesAfter(t0, 31) },
    ],
  });
  // Acute, the wrap (a required step) skipped, then ended early.
  const endedEarly = await finishedRun(therapistB, {
    athleteName: "Cy O'Neil",
    days: 1,
    createdDaysAgo: 20,
    entries: (t0) => [
      done(0, 'cold-pack', 1200, 1200, minutesAfter(t0, 20)),
      { type: 'step-skipped', stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 5, reason: 'no wrap in the kit', detail: 'required step', at: minutesAfter(t0, 21) },
      { type: 'run-ended-early', reason: 'athlete called to the bus', at: minutesAfter(t0, 22) },
    ],
  });
  // Ice massage ran to 7 min 30 s, past the 5–7 min of common practice.
  const longIce = await finishedRun(therapistB, {
    athleteName: 'Ana Quill II',
    days: 10,
    createdDaysAgo: 1,
    entries: (t0) => [done(0, 'ice-massage', 360, 450, minutesAfter(t0, 8)), { type: 'run-completed', at: minutesAfter(t0, 9) }],
  });
  // A red flag at the screening: recorded as stopped and referred.
  const referred = await finishedRun(therapistA, { athleteName: 'Dee Park', days: 2, screening: { ...clear, redFlags: ['pain-out-of-proportion'] }, entries: () => [] });
  // Still in progress: not on the review desk.
  const { injury: activeInjury } = await newInjury(therapistA, 'Eli Active', 10, false);
  const active = await therapistA.post('/api/runs').send({ injuryId: activeInjury.id, screening: clear });
  expect(active.body.run.status).toBe('ready');

  for (const [name, made] of Object.entries({ completed, fellBack, endedEarly, longIce, referred })) {
    runs[name] = { id: made.run.id, athleteId: made.athlete.id, injuryId: made.injury.id };
  }
  runs.active = { id: active.body.run.id, athleteId: '', injuryId: activeInjury.id };
});

const ids = (res: { body: { items: { id: string }[] } }) => res.body.items.map((row) => row.id);
const list = (agent: Agent, query: Record<string, string | number>) => agent.get(`/api/review/runs?${new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]))}`);

describe('the review runs list', () => {
  it('lists the finished runs newest first, with names, injury, phase, outcome, note status and attention flags', async () => {
    const res = await list(supervisor, {});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: 5, totalExact: true, page: 1, pageSize: 25 });
    expect(ids(res)).toEqual([runs.referred.id, runs.longIce.id, runs.completed.id, runs.fellBack.id, runs.endedEarly.id]);
    expect(ids(res)).not.toContain(runs.active.id);
    const byId = Object.fromEntries(res.body.items.map((row: { id: string }) => [row.id, row]));
    expect(byId[runs.fellBack.id]).toMatchObject({
      athleteName: 'Bea Ortiz',
      therapistName: 'Aoife Brennan',
      therapistId: therapistAId,
      injuryLabel: 'calf, left',
      phase: 'proliferative',
      status: 'fell-back',
      outcome: 'fell-back',
      noteStatus: 'none',
      attention: ['fell-back'],
    });
    expect(byId[runs.completed.id].attention).toEqual([]);
    expect(byId[runs.endedEarly.id].attention).toEqual(['skipped-steps', 'ended-early']);
    expect(byId[runs.longIce.id].attention).toEqual(['ice-massage-out-of-bounds']);
    expect(byId[runs.referred.id]).toMatchObject({ status: 'stopped-referred', attention: ['red-flag'], startedAt: null });
  });

  it('an admin of the clinic may read it; a therapist is refused every review route', async () => {
    expect((await list(admin, {})).status).toBe(200);
    for (const url of ['/api/review/runs', '/api/review/filters', `/api/review/runs/${runs.completed.id}`, '/api/review/adherence', '/api/review/runs.csv']) {
      const res = await therapistA.get(url);
      expect(res.status, url).toBe(403);
    }
  });

  it('filters by therapist, athlete, phase and outcome', async () => {
    expect(ids(await list(supervisor, { therapistId: therapistBId }))).toEqual([runs.longIce.id, runs.endedEarly.id]);
    expect(ids(await list(supervisor, { athleteId: runs.fellBack.athleteId }))).toEqual([runs.fellBack.id]);
    expect(ids(await list(supervisor, { phase: 'acute' }))).toEqual([runs.referred.id, runs.endedEarly.id]);
    expect(ids(await list(supervisor, { outcome: 'fell-back' }))).toEqual([runs.fellBack.id]);
    expect(ids(await list(supervisor, { outcome: 'stopped-referred' }))).toEqual([runs.referred.id]);
    expect(ids(await list(supervisor, { outcome: 'ended-early' }))).toEqual([runs.endedEarly.id]);
    const both = await list(supervisor, { therapistId: therapistAId, outcome: 'completed' });
    expect(ids(both)).toEqual([runs.completed.id]);
    expect(both.body.total).toBe(1);
  });

  it('filters by a date range of whole days in the clinic’s zone', async () => {
    expect(ids(await list(supervisor, { from: dayAgo(5) }))).toEqual([runs.referred.id, runs.longIce.id, runs.completed.id]);
    expect(ids(await list(supervisor, { from: dayAgo(15), to: dayAgo(5) }))).toEqual([runs.fellBack.id]);
    expect(ids(await list(supervisor, { to: dayAgo(15) }))).toEqual([runs.endedEarly.id]);
    // An instant works too: from two days ago to now.
    const instant = hoursAgo(48).toISOString();
    expect(ids(await list(supervisor, { from: instant, to: new Date().toISOString() }))).toEqual([runs.referred.id, runs.longIce.id]);
  });

  it('filters to the runs that need attention: a skipped optional step alone is not one of them', async () => {
    const res = await list(supervisor, { attention: 'true' });
    expect(ids(res)).toEqual([runs.referred.id, runs.longIce.id, runs.fellBack.id, runs.endedEarly.id]);
    expect(res.body.total).toBe(4);
    expect(ids(await list(supervisor, { attention: 'false' }))).toHaveLength(5);
  });

  it('filters by whether the note is signed', async () => {
    // The therapist writes and submits the note of the completed run; the supervisor signs it off.
    expect((await therapistA.get(`/api/runs/${runs.completed.id}/note`)).status).toBe(200);
    expect((await therapistA.post(`/api/runs/${runs.completed.id}/note/submit`)).status).toBe(200);
    expect((await supervisor.post(`/api/runs/${runs.completed.id}/sign-off`).send({})).status).toBe(200);
    // A draft alone is not signed.
    expect((await therapistA.get(`/api/runs/${runs.fellBack.id}/note`)).status).toBe(200);

    const signed = await list(supervisor, { noteSigned: 'true' });
    expect(ids(signed)).toEqual([runs.completed.id]);
    expect(signed.body.items[0].noteStatus).toBe('signed');
    const unsigned = await list(supervisor, { noteSigned: 'false' });
    expect(ids(unsigned)).toEqual([runs.referred.id, runs.longIce.id, runs.fellBack.id, runs.endedEarly.id]);
    expect(unsigned.body.items.find((row: { id: string }) => row.id === runs.fellBack.id).noteStatus).toBe('draft');
  });

  it('pages through every run exactly once, with the total on every page', async () => {
    const pages = await Promise.all([1, 2, 3].map((page) => list(supervisor, { pageSize: 2, page })));
    expect(pages.map((p) => p.body.total)).toEqual([5, 5, 5]);
    expect(pages.map((p) => ids(p).length)).toEqual([2, 2, 1]);
    const seen = pages.flatMap(ids);
    expect(new Set(seen).size).toBe(5);
    expect(seen).toEqual(ids(await list(supervisor, {})));
    const beyond = await list(supervisor, { pageSize: 2, page: 4 });
    expect(beyond.body).toMatchObject({ items: [], total: 5, page: 4 });
  });

  it('counts the total from the end of a full page, in every sort order, both ways', async () => {
    for (const sort of ['createdAt', 'athleteName', 'therapistName', 'phase', 'outcome']) {
      for (const direction of ['asc', 'desc']) {
        const whole = ids(await list(supervisor, { sort, direction }));
        const pages = await Promise.all([1, 2, 3].map((page) => list(supervisor, { sort, direction, pageSize: 2, page })));
        expect(pages.map((p) => p.body.total), `${sort} ${direction}`).toEqual([5, 5, 5]);
        expect(pages.every((p) => p.body.totalExact)).toBe(true);
        expect(pages.flatMap(ids), `${sort} ${direction}`).toEqual(whole);
      }
    }
  });

  it('sorts by athlete, therapist, phase and outcome, both ways', async () => {
    const names = async (sort: string, direction: string) => (await list(supervisor, { sort, direction })).body.items.map((r: { athleteName: string }) => r.athleteName);
    expect(await names('athleteName', 'asc')).toEqual(['Ana Quill', 'Ana Quill II', 'Bea Ortiz', "Cy O'Neil", 'Dee Park']);
    expect(await names('athleteName', 'desc')).toEqual(['Dee Park', "Cy O'Neil", 'Bea Ortiz', 'Ana Quill II', 'Ana Quill']);
    const therapists = (await list(supervisor, { sort: 'therapistName', direction: 'asc' })).body.items.map((r: { therapistName: string }) => r.therapistName);
    expect(therapists).toEqual(['Aoife Brennan', 'Aoife Brennan', 'Aoife Brennan', 'Bram Keller', 'Bram Keller']);
    const phases = (await list(supervisor, { sort: 'phase', direction: 'asc' })).body.items.map((r: { phase: string }) => r.phase);
    expect(phases).toEqual(['acute', 'acute', 'proliferative', 'proliferative', 'proliferative']);
    const outcomes = (await list(supervisor, { sort: 'outcome', direction: 'desc' })).body.items.map((r: { outcome: string }) => r.outcome);
    expect(outcomes).toEqual(['stopped-referred', 'fell-back', 'ended-early', 'completed', 'completed']);
    // Oldest first.
    expect(ids(await list(supervisor, { sort: 'createdAt', direction: 'asc' }))).toEqual([runs.endedEarly.id, runs.fellBack.id, runs.completed.id, runs.longIce.id, runs.referred.id]);
  });

  it('refuses bad filters with 400 naming the field', async () => {
    const cases: [Record<string, string>, string][] = [
      [{ outcome: 'lost' }, 'outcome'],
      [{ phase: 'healed' }, 'phase'],
      [{ therapistId: 'nobody' }, 'therapistId'],
      [{ pageSize: '101' }, 'pageSize'],
      [{ page: '0' }, 'page'],
      [{ sort: 'colour' }, 'sort'],
      [{ direction: 'up' }, 'direction'],
      [{ from: '2026-13-40' }, 'from'],
      [{ noteSigned: 'maybe' }, 'noteSigned'],
      [{ from: '2026-03-10', to: '2026-03-01' }, 'to'],
    ];
    for (const [query, field] of cases) {
      const res = await list(supervisor, query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(Object.keys(res.body.error.fields), JSON.stringify(query)).toContain(field);
    }
  });

  it('another clinic sees none of these runs', async () => {
    const res = await list(otherSupervisor, {});
    expect(res.body).toMatchObject({ items: [], total: 0 });
    expect(ids(await list(otherSupervisor, { therapistId: therapistAId }))).toEqual([]);
  });

  it('offers the clinic’s therapists and athletes for the filter lists', async () => {
    const res = await supervisor.get('/api/review/filters');
    expect(res.status).toBe(200);
    expect(res.body.therapists.map((t: { name: string }) => t.name)).toEqual(expect.arrayContaining(['Aoife Brennan', 'Bram Keller']));
    expect(res.body.athletes.map((a: { name: string }) => a.name)).toEqual(expect.arrayContaining(['Ana Quill', 'Bea Ortiz', "Cy O'Neil"]));
    expect((await otherSupervisor.get('/api/review/filters')).body.athletes).toEqual([]);
  });
});

describe('the review run detail', () => {
  it('shows the run, every entry in order, a planned-against-actual timeline and the measurements around it', async () => {
    const injuryId = runs.fellBack.injuryId;
    // Measured again after the run ended (the run ended about two hours ago).
    expect((await therapistA.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: hoursAgo(1).toISOString(), painNprs: 5 })).status).toBe(201);
    expect((await therapistA.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: hoursAgo(0.5).toISOString(), painNprs: 3 })).status).toBe(201);

    const res = await supervisor.get(`/api/review/runs/${runs.fellBack.id}`);
    expect(res.status).toBe(200);
    const { run, entries, timeline, measurementsBefore, measurementsAfter, note } = res.body;
    expect(run).toMatchObject({ id: runs.fellBack.id, status: 'fell-back', athleteName: 'Bea Ortiz' });
    expect(entries.map((e: { type: string }) => e.type)).toEqual(['step-completed', 'step-interrupted', 'swelling-check', 'step-completed', 'step-completed', 'run-fell-back']);
    expect(timeline.map((r: { stepIndex: number | null; stage: string; result: string }) => [r.stepIndex, r.stage, r.result])).toEqual([
      [0, 'plan', 'completed'],
      [1, 'plan', 'interrupted'],
      [null, 'back-to-cold', 'completed'],
      [null, 'back-to-cold', 'completed'],
      [2, 'plan', 'not-reached'],
      [3, 'plan', 'not-reached'],
      [4, 'plan', 'not-reached'],
      [5, 'plan', 'not-reached'],
    ]);
    expect(timeline[1]).toMatchObject({ kind: 'light-strokes', plannedSeconds: 300, actualSeconds: 100, reason: 'swelling increased' });
    expect(timeline[0].startedAt).toBe(minutesAfter(new Date(Date.parse(entries[0].at)), -6));
    expect(measurementsBefore).toMatchObject({ painNprs: 4 });
    // The first measurement after the run, not the latest.
    expect(measurementsAfter).toMatchObject({ painNprs: 5 });
    expect(note).toMatchObject({ status: 'draft' });
    expect(res.body.attention).toEqual(['fell-back']);
  });

  it('has no note and no later measurement when none exist', async () => {
    const res = await supervisor.get(`/api/review/runs/${runs.endedEarly.id}`);
    expect(res.body.note).toBeNull();
    expect(res.body.measurementsAfter).toBeNull();
    expect(res.body.timeline.find((r: { result: string }) => r.result === 'skipped')).toMatchObject({ kind: 'compression-wrap', reason: 'no wrap in the kit' });
  });

  it("answers another clinic's run with 404, and a malformed id with 400", async () => {
    expect((await otherSupervisor.get(`/api/review/runs/${runs.completed.id}`)).status).toBe(404);
    expect((await supervisor.get(`/api/review/runs/${randomUUID()}`)).status).toBe(404);
    expect((await supervisor.get('/api/review/runs/not-a-run')).status).toBe(400);
  });
});

describe('stale runs', () => {
  it('a run left untouched for 12 hours shows as abandoned and needing attention', async () => {
    const clinic = await createClinic();
    const therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
    const lead = await signedInAgent(app, (await createStaff(clinic.id, 'supervisor')).email);
    const { injury } = await newInjury(therapist, 'Fen Idle', 10, false);
    const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
    expect((await list(lead, {})).body.total).toBe(0);
    // decisions.md: 12 hours without activity (the clinic default) closes a run as abandoned.
    await Run.update({ lastActivityAt: hoursAgo(13) }, { where: { id: run.id } });
    const res = await list(lead, {});
    expect(res.body.items).toHaveLength(1);
    expect(res.body.items[0]).toMatchObject({ id: run.id, status: 'abandoned', outcome: 'abandoned', attention: ['abandoned'] });
    expect(ids(await list(lead, { outcome: 'abandoned' }))).toEqual([run.id]);
  });
});

describe('adherence', () => {
  /*
   * Hand-computed from the runs above (ice massage within 5–7 min = 300–420 s, common practice):
   *   completed (A, proliferative): ice 360 ✓; 6 plan steps reached; the optional ice skipped — not a skip
   *   fellBack  (A, proliferative): ice 360 ✓; 2 plan steps reached (ice, strokes interrupted); back to cold not counted
   *   referred  (A, acute):          no steps
   *   endedEarly(B, acute):          2 plan steps reached, 1 required skip
   *   longIce   (B, proliferative):  ice 450 ✗; 1 plan step reached
   */
  it('gives the clinic’s and each therapist’s figures for the range', async () => {
    const res = await supervisor.get(`/api/review/adherence?from=${dayAgo(30)}&to=${dayAgo(0)}`);
    expect(res.status).toBe(200);
    expect(res.body.clinic).toEqual({
      runs: 5,
      iceMassageSteps: 3,
      iceMassageWithinBounds: 2,
      iceMassageShare: 2 / 3,
      fallbacks: 1,
      fallbackRate: 1 / 5,
      skippedSteps: 1,
      totalSteps: 11,
      skippedRate: 1 / 11,
      runsPerPhase: { acute: 2, proliferative: 3, remodelling: 0 },
    });
    expect(res.body.therapists).toEqual([
      {
        therapistId: therapistAId,
        name: 'Aoife Brennan',
        runs: 3,
        iceMassageSteps: 2,
        iceMassageWithinBounds: 2,
        iceMassageShare: 1,
        fallbacks: 1,
        fallbackRate: 1 / 3,
        skippedSteps: 0,
        totalSteps: 8,
        skippedRate: 0,
        runsPerPhase: { acute: 1, proliferative: 2, remodelling: 0 },
      },
      {
        therapistId: therapistBId,
        name: 'Bram Keller',
        runs: 2,
        iceMassageSteps: 1,
        iceMassageWithinBounds: 0,
        iceMassageShare: 0,
        fallbacks: 0,
        fallbackRate: 0,
        skippedSteps: 1,
        totalSteps: 3,
        skippedRate: 1 / 3,
        runsPerPhase: { acute: 1, proliferative: 1, remodelling: 0 },
      },
    ]);
    expect(Date.parse(res.body.to)).toBeGreaterThan(Date.parse(res.body.from));
  });

  it('counts only the runs in the range; without one, the last four weeks', async () => {
    const recent = await supervisor.get(`/api/review/adherence?from=${dayAgo(5)}`);
    expect(recent.body.clinic.runs).toBe(3);
    expect(recent.body.clinic.iceMassageShare).toBe(1 / 2);
    const fourWeeks = await supervisor.get('/api/review/adherence');
    expect(fourWeeks.body.clinic.runs).toBe(5);
    expect(Date.parse(fourWeeks.body.to) - Date.parse(fourWeeks.body.from)).toBe(28 * 86_400_000);
    expect((await supervisor.get('/api/review/adherence?from=soon')).status).toBe(400);
  });

  it('another clinic gets empty figures', async () => {
    const res = await otherSupervisor.get('/api/review/adherence');
    expect(res.body.clinic).toMatchObject({ runs: 0, iceMassageShare: null, fallbackRate: 0 });
    expect(res.body.therapists).toEqual([]);
  });
});
