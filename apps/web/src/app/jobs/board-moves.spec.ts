import type { Stage } from '@latchwork/jobs-domain';
import { planDrop, withCardMoved } from './board-moves';
import type { BoardColumn, JobRow } from './jobs-api';

function card(
  id: string,
  stage: Stage,
  value: number | null,
  heldFrom: Stage | null = null,
): JobRow {
  return {
    id,
    reference: `J-0000${id}`,
    title: 'Garage floor',
    stage,
    valueEstimateMinor: value,
    ownerUserId: null,
    ownerName: null,
    customerId: 'c',
    customerName: 'Hana Vickery',
    siteId: null,
    siteName: null,
    enquiryOn: '2026-01-05',
    stageChangedAt: '2026-01-05T10:00:00Z',
    installStartOn: null,
    heldFrom,
  };
}

function column(stage: Stage, cards: JobRow[]): BoardColumn {
  const values = cards.map((c) => c.valueEstimateMinor);
  return {
    stage,
    label: stage,
    count: cards.length,
    valueMinor: values.reduce<number>((a, v) => a + (v ?? 0), 0),
    unvalued: values.filter((v) => v === null).length,
    cards,
    more: false,
  };
}

// Expected outcomes read off the transition grid in libs/jobs/domain/README.md.
describe('planDrop', () => {
  it('moves forward without asking', () => {
    expect(planDrop(card('1', 'enquiry', 1), 'survey_booked')).toEqual({ kind: 'move' });
    expect(planDrop(card('1', 'quoted', 1), 'won')).toEqual({ kind: 'move' });
  });

  it('asks why before losing a job or moving it backwards', () => {
    const lose = planDrop(card('1', 'quoted', 1), 'lost');
    expect(lose.kind).toBe('ask-reason');
    expect(planDrop(card('1', 'surveyed', 1), 'survey_booked').kind).toBe('ask-reason');
  });

  it('refuses what the table does not allow, with the sentence the API would give', () => {
    const plan = planDrop(card('1', 'enquiry', 1), 'paid');
    expect(plan).toEqual({
      kind: 'refuse',
      message: expect.stringContaining("can't go from “Enquiry” to “Paid”"),
    });
    expect(planDrop(card('1', 'cancelled', 1), 'enquiry').kind).toBe('refuse');
  });

  it('lets a job on hold go back only where it was held from', () => {
    expect(planDrop(card('1', 'on_hold', 1, 'quoted'), 'quoted')).toEqual({ kind: 'move' });
    const elsewhere = planDrop(card('1', 'on_hold', 1, 'quoted'), 'surveyed');
    expect(elsewhere).toMatchObject({
      kind: 'refuse',
      message: expect.stringContaining('Quote sent'),
    });
  });

  it('does nothing for a drop back on its own column', () => {
    expect(planDrop(card('1', 'won', 1), 'won')).toEqual({ kind: 'stay' });
  });
});

describe('withCardMoved', () => {
  const board = [
    column('enquiry', [card('1', 'enquiry', 125_050), card('2', 'enquiry', null)]),
    column('survey_booked', [card('3', 'survey_booked', 99_999)]),
  ];

  it('carries count and value to the new column and puts the card on top', () => {
    const moved = withCardMoved(board, '1', 'survey_booked');
    expect(moved.map((c) => [c.stage, c.count, c.valueMinor, c.unvalued])).toEqual([
      ['enquiry', 1, 0, 1],
      ['survey_booked', 2, 225_049, 0],
    ]);
    expect(moved[1]?.cards.map((c) => [c.id, c.stage])).toEqual([
      ['1', 'survey_booked'],
      ['3', 'survey_booked'],
    ]);
  });

  it('counts an unvalued card as unvalued, and leaves the board given untouched', () => {
    const moved = withCardMoved(board, '2', 'survey_booked');
    expect(moved[1]).toMatchObject({ count: 2, valueMinor: 99_999, unvalued: 1 });
    expect(board[0]?.count).toBe(2);
    expect(board[1]?.cards).toHaveLength(1);
  });

  it('remembers where a job was held from', () => {
    const held = withCardMoved([...board, column('on_hold', [])], '3', 'on_hold');
    expect(held[2]?.cards[0]).toMatchObject({ stage: 'on_hold', heldFrom: 'survey_booked' });
  });
});
