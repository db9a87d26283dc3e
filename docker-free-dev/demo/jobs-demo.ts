import { checkMove, formatReference, STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { nextNumber } from '@latchwork/shared-db';
import type { DemoFirm, DemoStep } from './demo-context';

/*
 * Demo jobs over the customers and sites the customers step made: every stage, enquiries over
 * the last 18 months, each job walked to its stage through moves the stage table allows
 * (checked with checkMove), with plausible dates, owners, values and a few notes.
 */

/** The usual road from Enquiry to Paid. */
const ROAD: Stage[] = [
  'survey_booked',
  'surveyed',
  'quoted',
  'won',
  'scheduled',
  'installing',
  'completed',
  'invoiced',
  'paid',
];
/** The road up to and including `to`, leaving out the stages a shortcut skips. */
const along = (to: Stage, skip: Stage[] = []): [Stage, string?][] =>
  ROAD.slice(0, ROAD.indexOf(to) + 1)
    .filter((s) => !skip.includes(s))
    .map((s) => [s]);

/**
 * The moves from Enquiry to each stage, a reason where the table wants one; some take the
 * table's shortcuts (surveyed on the first visit, accepted and booked in one call).
 */
const PATHS: Record<Stage, [Stage, string?][]> = {
  enquiry: [],
  survey_booked: along('survey_booked'),
  surveyed: along('surveyed'),
  quoted: along('quoted'),
  won: along('won'),
  lost: [...along('quoted'), ['lost', 'Went with a cheaper quote']],
  scheduled: along('scheduled', ['survey_booked']),
  installing: along('installing', ['won']),
  completed: along('completed'),
  invoiced: along('invoiced', ['survey_booked']),
  paid: along('paid'),
  on_hold: [...along('survey_booked'), ['on_hold', 'Customer waiting on a building warrant']],
  cancelled: [...along('won'), ['cancelled', 'Unit sold before the install']],
};
/** From young to old: a recent enquiry is rarely paid, an old one rarely still an enquiry. */
const BY_AGE: Stage[] = [
  'enquiry',
  'survey_booked',
  'surveyed',
  'quoted',
  'on_hold',
  'won',
  'lost',
  'scheduled',
  'installing',
  'completed',
  'cancelled',
  'invoiced',
  'paid',
];
const LOST_REASONS = [
  'Went with a cheaper quote',
  'Decided on paint instead',
  'Budget moved to next year',
];

/** Job titles and a value range in pounds, by what the site's name says it is. */
const KINDS: [RegExp, string[], number, number][] = [
  [
    /warehouse|storage|store|loading|distribution/i,
    ['Warehouse aisles', 'Racking aisles', 'Loading bay floor'],
    12_000,
    80_000,
  ],
  [
    /gym|fitness|sports|studio|pavilion/i,
    ['Gym floor', 'Sports hall floor', 'Studio floor'],
    6_000,
    25_000,
  ],
  [/showroom|counter|shop/i, ['Showroom floor', 'Shop floor refit'], 5_000, 20_000],
  [
    /workshop|garage|bay|repair|pit|machine/i,
    ['Workshop floor', 'Service bay tiles', 'Workshop with ramps'],
    3_000,
    15_000,
  ],
];
/** Homes and anything the patterns above do not name. */
const HOME: [RegExp, string[], number, number] = [
  /./,
  ['Garage floor', 'Home gym', 'Garage and utility room', 'Hobby workshop'],
  1_200,
  4_500,
];

const DAY = 86_400_000;
const iso = (d: Date) => d.toISOString().slice(0, 10);

interface Place {
  customerId: string;
  siteId: string;
  siteName: string;
}

async function placesOf(firm: DemoFirm): Promise<Place[]> {
  const rows = await firm.tx
    .selectFrom('site')
    .select(['id', 'customerId', 'name'])
    .where('tenantId', '=', firm.tenantId)
    .orderBy('createdAt')
    .orderBy('id')
    .execute();
  return rows.map((r) => ({ customerId: r.customerId, siteId: r.id, siteName: r.name }));
}

/** One job: walked from Enquiry to `target`, each move on a later day, none after today. */
async function demoJob(
  firm: DemoFirm,
  place: Place,
  target: Stage,
  enquired: Date,
  owners: string[],
  prefix: string,
) {
  const pick = <T>(list: readonly T[]) => list[Math.floor(firm.random() * list.length)] as T;
  const [, titles, low, high] = KINDS.find(([re]) => re.test(place.siteName)) ?? HOME;
  const pounds = Math.round((low + firm.random() * (high - low)) / 10) * 10;
  const owner = pick(owners);
  const path = PATHS[target].map(
    ([to, reason]) => [to, to === 'lost' ? pick(LOST_REASONS) : reason] as const,
  );
  // Moves share the time since the enquiry, so an old job's last move can be long ago.
  const span = Math.max(firm.today.getTime() - enquired.getTime() - DAY, DAY);
  const times = path
    .map(() => firm.random())
    .sort()
    .map((f) => new Date(enquired.getTime() + DAY / 2 + f * span));
  // The firm's counter, as the API takes it, so the API's next job follows on without a gap.
  const number = await nextNumber(firm.tx, firm, 'job_counter');
  const reference = formatReference(prefix, number);
  const at = (stage: Stage) => times[path.findIndex(([to]) => to === stage)];
  const later = (from: Date | undefined, days: number) =>
    from && new Date(from.getTime() + days * DAY);
  // The visit is when the job became surveyed; a job only booked is visited two days on.
  const surveyed = at('surveyed') ?? later(at('survey_booked'), 2);
  // Fitting starts when the job moved to fitting, else ten days after it was booked in.
  const installed = at('installing') ?? later(at('scheduled'), 10);
  const fitted = at('completed') ?? later(installed, 2);
  const job = await firm.tx
    .insertInto('job')
    .values({
      tenantId: firm.tenantId,
      number,
      reference,
      title: pick(titles),
      customerId: place.customerId,
      siteId: place.siteId,
      // One in ten enquiries has no figure yet; values are whole pounds, in pence.
      valueEstimateMinor: target === 'enquiry' && firm.random() < 0.4 ? null : pounds * 100,
      source: pick(['Website', 'Referral', 'Returning customer', 'Trade show', 'Phone']),
      ownerUserId: owner,
      enquiryOn: iso(enquired),
      surveyAt: surveyed ? surveyed.toISOString() : null,
      quoteDueOn: surveyed ? iso(new Date(surveyed.getTime() + 5 * DAY)) : null,
      installStartOn: installed ? iso(installed) : null,
      installEndOn: fitted ? iso(fitted) : null,
      createdBy: owner,
      createdAt: enquired,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await firm.tx
    .insertInto('jobStageMove')
    .values({
      tenantId: firm.tenantId,
      jobId: job.id,
      toStage: 'enquiry',
      movedBy: owner,
      movedAt: enquired,
    })
    .execute();
  await firm.tx
    .insertInto('jobEvent')
    .values({
      tenantId: firm.tenantId,
      jobId: job.id,
      kind: 'created',
      summary: `Job ${reference} opened at Enquiry`,
      actorUserId: owner,
      createdAt: enquired,
    })
    .execute();
  let from: Stage = 'enquiry';
  for (const [i, [to, reason]] of path.entries()) {
    const check = checkMove(from, to, { reason });
    if (!check.ok) throw new Error(`demo path to ${target}: ${check.message}`);
    const movedAt = times[i] as Date;
    await firm.tx
      .insertInto('jobStageMove')
      .values({
        tenantId: firm.tenantId,
        jobId: job.id,
        fromStage: from,
        toStage: to,
        reason: check.reason,
        movedBy: owner,
        movedAt,
      })
      .execute();
    await firm.tx
      .insertInto('jobEvent')
      .values({
        tenantId: firm.tenantId,
        jobId: job.id,
        kind: 'stage-move',
        summary: `Moved from ${STAGE_LABELS[from]} to ${STAGE_LABELS[to]}${check.reason ? `: ${check.reason}` : ''}`,
        detail: { from, to, reason: check.reason },
        actorUserId: owner,
        createdAt: movedAt,
      })
      .execute();
    from = to;
  }
  const last = times.at(-1) ?? enquired;
  await firm.tx
    .updateTable('job')
    .set({
      stage: from,
      stageChangedAt: last,
      lostReason: from === 'lost' ? (path.at(-1)?.[1] ?? null) : null,
    })
    .where('tenantId', '=', firm.tenantId)
    .where('id', '=', job.id)
    .execute();
  return { id: job.id, owner, last };
}

const NOTES = [
  '@{name} the customer asked for the tiles to run parallel to the roller door.',
  'Slab looks damp near the back wall; @{name} can you bring the hygrometer on the survey?',
  'Gate code 4471. @{name} please confirm the skip is booked before the install.',
];

/** ~120 jobs for Kestrel, a handful for every other firm; nothing without customers. */
export const jobsDemo: DemoStep = async (firm) => {
  const places = await placesOf(firm);
  if (!places.length) return '';
  const team = await firm.tx
    .selectFrom('appUser')
    .select(['id', 'name'])
    .where('id', 'in', [...firm.members.values()])
    .execute();
  const owners = [...firm.members]
    .filter(([email]) => /^(owner|estimator)@/.test(email))
    .map(([, id]) => id);
  const tenant = await firm.tx
    .selectFrom('tenant')
    .select('numberPrefixes')
    .where('id', '=', firm.tenantId)
    .executeTakeFirstOrThrow();
  const prefix = tenant.numberPrefixes['job'] ?? '';
  const count = firm.slug === 'kestrel-floorworks' ? 120 : 6;
  const ages = Array.from({ length: count }, (_, i) =>
    Math.round(540 * (1 - (i + firm.random() * 0.9) / count)),
  );
  const targets = ages.map((daysAgo) => {
    // The stage follows the age, with some spread either way.
    const index = Math.round((daysAgo / 540) * (BY_AGE.length - 1) + (firm.random() - 0.5) * 4);
    return BY_AGE[Math.min(BY_AGE.length - 1, Math.max(0, index))] as Stage;
  });
  // Every column of the board has something: a missing stage takes the job closest in age.
  if (count >= BY_AGE.length)
    for (const [k, stage] of BY_AGE.entries()) {
      if (targets.includes(stage)) continue;
      const want = 540 * (k / (BY_AGE.length - 1));
      const free = ages
        .map((a, i) => [Math.abs(a - want), i] as const)
        .filter(([, i]) => targets.filter((t) => t === targets[i]).length > 1);
      const closest = free.sort((a, b) => a[0] - b[0])[0];
      if (closest) targets[closest[1]] = stage;
    }
  const made = [];
  for (let i = 0; i < count; i++) {
    // Older enquiries first, so job numbers rise with the enquiry date as they do in life.
    const enquired = new Date(firm.today.getTime() - (ages[i] ?? 0) * DAY);
    const place = places[i % places.length] as Place;
    made.push(
      await demoJob(
        firm,
        place,
        targets[i] as Stage,
        enquired,
        owners.length ? owners : [...firm.members.values()],
        prefix,
      ),
    );
  }
  let notes = 0;
  for (const [i, job] of made.entries()) {
    if (i % 9 !== 4 || team.length < 2) continue;
    const mentioned = team[(i / 9) % team.length | 0] ?? team[0];
    const body = (NOTES[notes % NOTES.length] ?? '').replace('{name}', mentioned?.name ?? '');
    const author = job.owner;
    const note = await firm.tx
      .insertInto('jobNote')
      .values({
        tenantId: firm.tenantId,
        jobId: job.id,
        authorUserId: author,
        body,
        mentions: mentioned ? [mentioned.id] : [],
        createdAt: job.last,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const authorName = team.find((t) => t.id === author)?.name ?? 'Someone';
    await firm.tx
      .insertInto('jobEvent')
      .values({
        tenantId: firm.tenantId,
        jobId: job.id,
        kind: 'note',
        summary: `${authorName} added a note mentioning ${mentioned?.name}`,
        detail: { noteId: note.id },
        actorUserId: author,
        createdAt: job.last,
      })
      .execute();
    notes++;
  }
  return `${made.length} jobs over ${new Set(targets).size} stages with their histories, ${notes} notes`;
};
