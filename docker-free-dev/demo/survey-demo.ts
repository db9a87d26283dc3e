import type { TakeoffInput } from '@latchwork/takeoff';
import type { DemoFirm, DemoStep } from './demo-context';
import { firmSlabLimits, recordReading, saveSurvey, saveVersion } from '@latchwork/jobs-server';

type Substrate = 'concrete' | 'screed' | 'asphalt' | 'timber' | 'existing_floor';
type Pt = [number, number];

const rect = (w: number, l: number, x = 0, y = 0): Pt[] => [
  [x, y],
  [x + w, y],
  [x + w, y + l],
  [x, y + l],
];
/** A square column of side `s` centred on (x, y). */
const column = (x: number, y: number, s = 400): Pt[] => rect(s, s, x - s / 2, y - s / 2);

/** Floors as surveyors find them, in mm: doorways on the front wall, columns where halls have them. */
const FLOORS: Record<string, (name: string) => { name: string; input: TakeoffInput }> = {
  garage: (name) => ({
    name,
    input: {
      outline: rect(6000, 6000),
      doorways: [{ from: [1800, 0], to: [4200, 0], ramp: true }],
      tile: { pitchMm: 500 },
      origin: 'centre',
      pattern: { kind: 'single', colour: 'Graphite' },
      // Hot spot under the parked car's tyres: glued down.
      zones: { adhesive: [rect(2000, 1500, 2000, 1000)] },
    },
  }),
  workshop: (name) => ({
    name,
    input: {
      outline: rect(12000, 8000),
      obstacles: [column(4000, 4000), column(8000, 4000)],
      doorways: [{ from: [3000, 0], to: [6000, 0], ramp: true }],
      tile: { pitchMm: 500 },
      origin: 'auto',
      pattern: { kind: 'border', rows: 1, borderColour: 'Signal yellow', fieldColour: 'Graphite' },
      zones: { levelling: [{ polygon: rect(2000, 2000, 9000, 5000), depthMm: 4 }] },
    },
  }),
  gym: (name) => ({
    name,
    input: {
      outline: rect(20000, 15000),
      doorways: [{ from: [9000, 0], to: [11000, 0] }],
      tile: { pitchMm: 500 },
      origin: 'centre',
      pattern: { kind: 'chequer', colours: ['Slate blue', 'Graphite'] },
    },
  }),
  warehouse: (name) => ({
    name,
    input: {
      outline: rect(40000, 25000),
      obstacles: [8000, 16000, 24000, 32000].flatMap((x) => [
        column(x, 8000, 500),
        column(x, 17000, 500),
      ]),
      doorways: [{ from: [16000, 0], to: [20000, 0], ramp: true }],
      tile: { pitchMm: 500 },
      origin: 'auto',
      pattern: {
        kind: 'bays',
        baseColour: 'Graphite',
        bays: [{ polygon: rect(40000 - 100, 2000, 50, 11500), colour: 'Signal yellow' }],
      },
      // Turning traffic at the loading door.
      zones: { adhesive: [rect(6000, 4000, 15000, 0)] },
    },
  }),
  showroom: (name) => ({
    name,
    input: {
      outline: [
        [0, 0],
        [14000, 0],
        [14000, 6000],
        [8000, 6000],
        [8000, 10000],
        [0, 10000],
      ],
      doorways: [{ from: [5000, 0], to: [7000, 0] }],
      tile: { pitchMm: 500 },
      origin: 'auto',
      pattern: { kind: 'single', colour: 'Stone grey' },
    },
  }),
};

/** The areas a job's title suggests: most jobs are garages; big jobs name their building. */
function areasFor(title: string, random: () => number) {
  const t = title.toLowerCase();
  if (t.includes('warehouse'))
    return [FLOORS['warehouse']('Warehouse floor'), FLOORS['workshop']('Goods-in bay')];
  if (t.includes('gym')) return [FLOORS['gym']('Gym floor')];
  if (t.includes('workshop') || t.includes('unit')) return [FLOORS['workshop']('Workshop')];
  if (t.includes('showroom')) return [FLOORS['showroom']('Showroom')];
  if (t.includes('garage') && random() < 0.4)
    return [FLOORS['garage']('Garage bay 1'), FLOORS['garage']('Garage bay 2')];
  if (t.includes('garage')) return [FLOORS['garage']('Garage')];
  const kinds = ['garage', 'garage', 'workshop', 'gym', 'showroom', 'warehouse'];
  const kind = kinds[Math.floor(random() * kinds.length)] ?? 'garage';
  return [FLOORS[kind](kind === 'gym' ? 'Gym floor' : kind[0].toUpperCase() + kind.slice(1))];
}

const SUBSTRATES: Substrate[] = [
  'concrete',
  'concrete',
  'concrete',
  'screed',
  'asphalt',
  'existing_floor',
  'timber',
];
const SURVEYED_OR_LATER = [
  'surveyed',
  'quoted',
  'won',
  'scheduled',
  'installing',
  'completed',
  'invoiced',
  'paid',
] as const;

/** Readings a surveyor takes; `wet` and `cold` jobs get the failing ones. */
function readingsFor(random: () => number, wet: boolean, cold: boolean, area: string) {
  const pick = (lo: number, hi: number) => Math.round((lo + random() * (hi - lo)) * 10) / 10;
  return [
    {
      kind: 'relative_humidity',
      method: 'hood_hygrometer',
      value: wet ? pick(78, 86) : pick(52, 72),
      location: `${area}, centre`,
    },
    ...(wet
      ? [
          {
            kind: 'relative_humidity',
            method: 'in_slab_probe',
            value: 82,
            location: `${area}, by the door`,
          },
        ]
      : []),
    {
      kind: 'air_temperature',
      method: 'thermometer',
      value: cold ? pick(9, 13) : pick(16, 21),
      location: area,
    },
    {
      kind: 'slab_temperature',
      method: 'surface_probe',
      value: cold ? 11 : pick(15.5, 19),
      location: area,
    },
    {
      kind: 'surface_regularity',
      method: 'straightedge_2m',
      value: pick(1.5, random() < 0.08 ? 7 : 4.6),
      location: area,
    },
  ];
}

async function surveyJob(
  firm: DemoFirm,
  job: { id: string; title: string; surveyedAt: Date },
  surveyor: string,
) {
  const { tx, random } = firm;
  const scope = { tenantId: firm.tenantId };
  const substrate = SUBSTRATES[Math.floor(random() * SUBSTRATES.length)] ?? 'concrete';
  await saveSurvey(tx, scope, job.id, {
    substrate,
    surveyedAt: job.surveyedAt.toISOString(),
    surveyorUserId: surveyor,
    notes:
      substrate === 'existing_floor'
        ? 'Old coating flaking by the door: grind back before fitting.'
        : '',
  });
  const limits = await firmSlabLimits(tx, scope);
  // About one job in twelve has a damp slab, and winter surveys find cold rooms.
  const wet = random() < 0.08;
  const month = job.surveyedAt.getUTCMonth();
  const cold = (month <= 1 || month === 11) && random() < 0.35;
  const areas = areasFor(job.title, random);
  for (const floor of areas) {
    const area = await tx
      .insertInto('surveyArea')
      .values({ tenantId: firm.tenantId, jobId: job.id, name: floor.name, createdBy: surveyor })
      .returning('id')
      .executeTakeFirstOrThrow();
    await saveVersion(tx, scope, area.id, floor.input, surveyor);
  }
  const areaName = areas[0]?.name ?? 'Floor';
  let failing = false;
  for (const r of readingsFor(random, wet, cold, areaName)) {
    const input = { ...r, takenAt: job.surveyedAt.toISOString() } as Parameters<
      typeof recordReading
    >[3];
    const saved = await recordReading(tx, scope, job.id, input, limits, surveyor);
    failing ||= saved.status === 'fail';
  }
  return { areas: areas.length, failing };
}

/** Surveys, areas with one computed takeoff each, and slab readings for jobs past the survey. */
export const surveyDemo: DemoStep = async (firm) => {
  if (firm.slug !== 'kestrel-floorworks') return '';
  const jobs = await firm.tx
    .selectFrom('job')
    .select(['id', 'title', 'surveyAt', 'enquiryOn'])
    .where('tenantId', '=', firm.tenantId)
    .where('stage', 'in', [...SURVEYED_OR_LATER])
    .orderBy('number')
    .execute();
  if (!jobs.length) return '';
  const surveyor = firm.members.get('estimator@kestrel-floorworks.test') ?? null;
  if (!surveyor) return '';
  let areas = 0;
  let failing = 0;
  for (const job of jobs) {
    const surveyedAt =
      job.surveyAt ?? new Date(Date.parse(`${job.enquiryOn}T10:00:00Z`) + 7 * 86_400_000);
    const done = await surveyJob(firm, { id: job.id, title: job.title, surveyedAt }, surveyor);
    areas += done.areas;
    if (done.failing) failing++;
  }
  return `${jobs.length} surveys, ${areas} areas with takeoffs, ${failing} with failing readings`;
};
