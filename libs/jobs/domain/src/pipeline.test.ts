import fc from 'fast-check';
import { sum } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { isIsoDate, pipelineSummary, type PipelineJob } from './pipeline';
import { PIPELINE_CSV_HEADER, pipelineCsv, pipelineCsvCells } from './pipeline-csv';
import { OPEN_PIPELINE_STAGES, STAGES } from './stages';

const job = (over: Partial<PipelineJob>): PipelineJob => ({
  id: 'j',
  reference: 'J-00001',
  title: 'Garage floor',
  stage: 'enquiry',
  valueMinor: 100_00,
  ownerId: 'u1',
  customerId: 'c1',
  enquiredOn: '2025-03-01',
  ...over,
});

const jobs: PipelineJob[] = [
  job({ id: '1', stage: 'enquiry', valueMinor: 1_200_00 }),
  job({ id: '2', stage: 'quoted', valueMinor: 4_850_50, ownerId: 'u2' }),
  job({ id: '3', stage: 'quoted', valueMinor: null, customerId: 'c2' }),
  job({ id: '4', stage: 'won', valueMinor: 9_999_99, enquiredOn: '2025-05-10' }),
  job({ id: '5', stage: 'on_hold', valueMinor: 3_000_00 }),
  job({ id: '6', stage: 'invoiced', valueMinor: 7_000_00, ownerId: null }),
  job({ id: '7', stage: 'lost', valueMinor: 500_00, enquiredOn: '2024-12-31' }),
];

describe('pipelineSummary', () => {
  it('adds count and value per stage and for the open pipeline (worked by hand)', () => {
    const s = pipelineSummary(jobs);
    const quoted = s.stages.find((t) => t.stage === 'quoted');
    expect(quoted).toMatchObject({
      label: 'Quote sent',
      count: 2,
      valueMinor: 4_850_50,
      unvalued: 1,
    });
    expect(s.stages.map((t) => t.stage)).toEqual(STAGES);
    // Open = enquiry 1200.00 + quoted 4850.50 + won 9999.99; hold, invoiced, lost left out.
    expect(s.openPipeline).toEqual({ count: 4, valueMinor: 16_050_49, unvalued: 1 });
    expect(s.all).toEqual({ count: 7, valueMinor: 26_550_49, unvalued: 1 });
  });

  it('filters by owner (null = nobody), customer, date range and value range', () => {
    expect(pipelineSummary(jobs, { ownerIds: ['u2'] }).all.count).toBe(1);
    expect(pipelineSummary(jobs, { ownerIds: [null] }).all.valueMinor).toBe(7_000_00);
    expect(pipelineSummary(jobs, { customerIds: ['c2'] }).all.count).toBe(1);
    const inRange = pipelineSummary(jobs, { from: '2025-01-01', to: '2025-03-01' });
    expect(inRange.all.count).toBe(5); // inclusive at both ends
    const byValue = pipelineSummary(jobs, { minValueMinor: 3_000_00, maxValueMinor: 7_000_00 });
    expect(byValue.all).toEqual({ count: 3, valueMinor: 14_850_50, unvalued: 0 });
    const stageDate = pipelineSummary(jobs, { dateField: 'stageChangedOn', from: '2025-01-01' });
    expect(stageDate.all.count).toBe(0);
  });

  it('refuses float money and bad filter dates', () => {
    expect(() => pipelineSummary([job({ valueMinor: 10.5 })])).toThrow(RangeError);
    expect(() => pipelineSummary(jobs, { from: '2025-02-30' })).toThrow(/Not a date/);
    expect(() => pipelineSummary(jobs, { minValueMinor: 0.5 })).toThrow(RangeError);
    expect(isIsoDate('2024-02-29')).toBe(true);
    expect(isIsoDate('2025-02-29')).toBe(false);
  });

  it('open total equals the sum over open stages, by simple-statistics sum (property)', () => {
    const jobArb = fc.record({
      stage: fc.constantFrom(...STAGES),
      valueMinor: fc.option(fc.integer({ min: 0, max: 10_000_000_00 })),
      ownerId: fc.constantFrom('a', 'b', null),
    });
    fc.assert(
      fc.property(
        fc.array(jobArb, { maxLength: 60 }),
        fc.constantFrom('a', 'b', null),
        (rows, owner) => {
          const list = rows.map((r, i) => job({ ...r, id: String(i) }));
          const s = pipelineSummary(list, { ownerIds: [owner] });
          const mine = list.filter((j) => j.ownerId === owner);
          const openValues = mine
            .filter((j) => OPEN_PIPELINE_STAGES.includes(j.stage))
            .map((j) => j.valueMinor ?? 0);
          expect(s.openPipeline.valueMinor).toBe(sum(openValues));
          expect(sum(s.stages.map((t) => t.count))).toBe(mine.length);
          expect(sum(s.stages.map((t) => t.valueMinor))).toBe(
            sum(mine.map((j) => j.valueMinor ?? 0)),
          );
        },
      ),
    );
  });
});

describe('pipeline CSV export', () => {
  it('writes the value as plain decimal text and quotes awkward titles (RFC 4180)', () => {
    const j = job({
      title: 'Workshop, bays 1–3 "as drawn"',
      customerName: 'Harrow & Vale Motors',
      valueMinor: 12_345_67,
      ownerName: 'Dee Okafor',
    });
    expect(pipelineCsvCells(j)).toEqual([
      'J-00001',
      'Workshop, bays 1–3 "as drawn"',
      'Harrow & Vale Motors',
      'Enquiry',
      '12345.67',
      'Dee Okafor',
      '2025-03-01',
      '',
      '',
    ]);
    const text = pipelineCsv([j]);
    expect(text.startsWith(`\uFEFF${PIPELINE_CSV_HEADER.join(',')}\r\n`)).toBe(true);
    expect(text).toContain('J-00001,"Workshop, bays 1–3 ""as drawn""",Harrow & Vale Motors,');
    expect(pipelineCsv([job({ valueMinor: 1500 })], 0)).toContain(',1500,');
  });
});
