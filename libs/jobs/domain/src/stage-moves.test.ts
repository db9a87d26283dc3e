import { describe, expect, it } from 'vitest';
import { canMove, checkMove, heldFromOf, nextStages, reasonRequired } from './stage-moves';
import { STAGE_MOVES } from './stage-table';
import {
  CLOSED_STAGES,
  OPEN_PIPELINE_STAGES,
  STAGE_LABELS,
  STAGES,
  isStage,
  type Stage,
} from './stages';

// Source: the transition grid in libs/jobs/domain/README.md (our decision, written there
// first and copied here by hand). Rows = from, columns = to, both in STAGES order.
// '.' refused · 'f' allowed, no reason · 'r' allowed with a reason · 'h' only back to the
// stage it was held from.
const GRID = `
                enq sb  sv  qt  won lost sch ins cmp inv paid hold canc
enquiry          .   f   f   f   .   r    .   .   .   .   .    r    r
survey_booked    r   .   f   f   .   r    .   .   .   .   .    r    r
surveyed         .   r   .   f   .   r    .   .   .   .   .    r    r
quoted           .   .   r   .   f   r    f   .   .   .   .    r    r
won              .   .   .   r   .   .    f   .   .   .   .    r    r
lost             r   .   .   r   .   .    .   .   .   .   .    .    .
scheduled        .   .   .   .   r   .    .   f   .   .   .    r    r
installing       .   .   .   .   .   .    r   .   f   .   .    r    r
completed        .   .   .   .   .   .    .   r   .   f   .    r    r
invoiced         .   .   .   .   .   .    .   .   r   .   f    .    .
paid             .   .   .   .   .   .    .   .   .   r   .    .    .
on_hold          h   h   h   h   h   .    h   h   h   .   .    .    r
cancelled        .   .   .   .   .   .    .   .   .   .   .    .    .
`;

function parseGrid(): Map<Stage, Map<Stage, string>> {
  const lines = GRID.trim().split('\n').slice(1);
  const grid = new Map<Stage, Map<Stage, string>>();
  for (const line of lines) {
    const [from, ...cells] = line.trim().split(/\s+/);
    if (!isStage(from) || cells.length !== STAGES.length) throw new Error(`bad row ${line}`);
    grid.set(from, new Map(STAGES.map((to, i) => [to, cells[i]])));
  }
  if (grid.size !== STAGES.length) throw new Error('grid must have a row per stage');
  return grid;
}

const grid = parseGrid();
const pairs = STAGES.flatMap((from) => STAGES.map((to) => [from, to] as const));

describe('stage moves: every pair against the README grid (exhaustive)', () => {
  it.each(pairs)('%s → %s', (from, to) => {
    const cell = grid.get(from)?.get(to);
    const withReason = checkMove(from, to, { reason: 'customer asked' });
    const without = checkMove(from, to);
    if (cell === '.') {
      expect(withReason.ok).toBe(false);
      expect(canMove(from, to)).toBe(false);
      // Even knowing the held-from stage opens nothing the grid refuses.
      for (const held of STAGES) expect(canMove(from, to, held)).toBe(false);
      expect(withReason.ok ? '' : withReason.code).toBe(from === to ? 'same-stage' : 'not-allowed');
    } else if (cell === 'f') {
      expect(without).toMatchObject({ ok: true, from, to, reason: null });
      expect(canMove(from, to)).toBe(true);
      expect(reasonRequired(from, to)).toBe(false);
    } else if (cell === 'r') {
      expect(without).toMatchObject({ ok: false, code: 'reason-required' });
      expect(checkMove(from, to, { reason: '   ' })).toMatchObject({ code: 'reason-required' });
      expect(withReason).toMatchObject({ ok: true, reason: 'customer asked' });
      expect(reasonRequired(from, to)).toBe(true);
    } else if (cell === 'h') {
      expect(without).toMatchObject({ ok: false, code: 'held-from-unknown' });
      expect(canMove(from, to, to)).toBe(true);
      expect(checkMove(from, to, { heldFrom: to }).ok).toBe(true);
      for (const other of STAGES.filter((s) => s !== to)) {
        expect(checkMove(from, to, { heldFrom: other })).toMatchObject({
          ok: false,
          code: 'resume-elsewhere',
        });
      }
    } else {
      throw new Error(`unknown cell ${cell}`);
    }
  });

  it('the table holds no move the grid lacks (counts match)', () => {
    const allowedInGrid = pairs.filter(([f, t]) => grid.get(f)?.get(t) !== '.').length;
    const inTable = STAGES.reduce((n, f) => n + Object.keys(STAGE_MOVES[f]).length, 0);
    expect(inTable).toBe(allowedInGrid);
  });
});

describe('refusal messages (what the board shows when a drag snaps back)', () => {
  it('name both stages in trade words and list where the job can go', () => {
    const r = checkMove('quoted', 'installing');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.message).toContain(STAGE_LABELS.quoted);
      expect(r.message).toContain(STAGE_LABELS.installing);
      expect(r.message).toContain('Won, Lost, Booked in, On hold or Cancelled');
    }
  });

  it('explain closed and invoiced stages in their own words', () => {
    const msg = (from: Stage, to: Stage) => {
      const r = checkMove(from, to, { reason: 'x' });
      return r.ok ? '' : r.message;
    };
    expect(msg('cancelled', 'enquiry')).toMatch(/new job/);
    expect(msg('invoiced', 'cancelled')).toMatch(/credit note/);
    expect(msg('won', 'lost')).toMatch(/Cancelled/);
    expect(msg('lost', 'on_hold')).toMatch(/Reopen/);
    expect(msg('on_hold', 'won').length).toBeGreaterThan(20);
  });

  it('ask for the reason in words that fit the move', () => {
    const msg = (from: Stage, to: Stage) => {
      const r = checkMove(from, to);
      return r.ok ? '' : r.message;
    };
    expect(msg('quoted', 'lost')).toMatch(/lost/);
    expect(msg('won', 'cancelled')).toMatch(/cancelled/);
    expect(msg('won', 'on_hold')).toMatch(/on hold/);
    expect(msg('installing', 'scheduled')).toMatch(/back to “Booked in”/);
    expect(msg('paid', 'invoiced')).toMatch(/payment/);
  });
});

describe('next stages, held-from, groups', () => {
  it('nextStages follows the grid in board order', () => {
    for (const from of STAGES) {
      const expected = STAGES.filter((to) => ['f', 'r'].includes(grid.get(from)?.get(to) ?? ''));
      expect(nextStages(from)).toEqual(expected);
    }
    expect(nextStages('on_hold', 'quoted')).toEqual(['quoted', 'cancelled']);
  });

  it('heldFromOf reads the stage before the latest hold', () => {
    expect(
      heldFromOf([
        { from: null, to: 'enquiry' },
        { from: 'enquiry', to: 'on_hold' },
        { from: 'on_hold', to: 'enquiry' },
        { from: 'enquiry', to: 'quoted' },
        { from: 'quoted', to: 'on_hold' },
      ]),
    ).toBe('quoted');
    expect(heldFromOf([{ from: null, to: 'enquiry' }])).toBeUndefined();
    expect(heldFromOf([])).toBeUndefined();
  });

  it('open pipeline is enquiry … fitted; closed is lost, paid, cancelled (README)', () => {
    expect(OPEN_PIPELINE_STAGES).toEqual([
      'enquiry',
      'survey_booked',
      'surveyed',
      'quoted',
      'won',
      'scheduled',
      'installing',
      'completed',
    ]);
    expect(CLOSED_STAGES).toEqual(['lost', 'paid', 'cancelled']);
    // Every open stage can be held and cancelled (the brief's rule).
    for (const s of OPEN_PIPELINE_STAGES) {
      expect(canMove(s, 'on_hold')).toBe(true);
      expect(canMove(s, 'cancelled')).toBe(true);
    }
  });
});
