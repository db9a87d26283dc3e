import { openStockPage, type StockPageUnderTest } from '../stock-spec-setup';
import { CountReviewPage } from './count-review-page';
import type { Count, CountLine } from './counts-api';

/** One line of boxes of 20: 1 box booked, 19 tiles counted, given `reason`. */
function line(reason: string | null): CountLine {
  return {
    id: 'cl1',
    position: 0,
    productId: 'p1',
    sku: 'KS-7-GRA',
    productName: 'Keystep 7 mm, Graphite',
    batchCode: 'GRA-1',
    expiresOn: null,
    packSize: 20,
    decimals: 0,
    units: { unitOne: 'tile', unitOther: 'tiles', packOne: 'box', packOther: 'boxes' },
    counted: 19,
    countedPacks: '19 tiles',
    countedAt: '2026-12-02T08:00:00Z',
    expectedAtStart: 20,
    expectedAtStartPacks: '1 box',
    movementsDuring: 0,
    movementsDuringPacks: '0 tiles',
    expected: 20,
    expectedPacks: '1 box',
    variance: -1,
    variancePacks: '-1 tile',
    unitCostMinor: 298,
    varianceValueMinor: -298,
    reason,
    reasonNote: reason ? 'not on the van' : '',
  };
}

function count(status: Count['status'], reason: string | null): Count {
  return {
    id: 'c1',
    locationId: 'van',
    locationName: 'Van 1 (WX19 KFL)',
    status,
    scope: 'all',
    note: '',
    startedAt: '2026-12-02T07:30:00Z',
    postedAt: status === 'posted' ? '2026-12-02T09:00:00Z' : null,
    netValueMinor: -298,
    grossValueMinor: 298,
    approvedBy: null,
    lines: [line(reason)],
    variance: {
      netValueMinor: -298,
      grossValueMinor: 298,
      thresholdMinor: 10000,
      needsApproval: false,
    },
  };
}

describe('CountReviewPage', () => {
  let t: StockPageUnderTest;

  afterEach(() => t.backend.verify());

  const cells = () => [...t.el().querySelectorAll('tbody tr td')].map((c) => c.textContent?.trim());

  it('shows book figures in packs and a posted reason in words, not its code', async () => {
    t = await openStockPage('counts/:countId', CountReviewPage, '/counts/c1');
    t.backend.expectOne('/api/v1/stock/counts/c1').flush(count('posted', 'lost'));
    await t.settle();
    expect(cells().slice(1)).toEqual([
      '1 box',
      '—',
      '1 box',
      '19 tiles',
      '-1 tile',
      '-£2.98',
      'Lost or missing — not on the van',
    ]);
    expect(t.el().textContent).toContain('Posted.');
  });

  it('saves the reason chosen, then posts', async () => {
    t = await openStockPage('counts/:countId', CountReviewPage, '/counts/c1');
    t.backend.expectOne('/api/v1/stock/counts/c1').flush(count('submitted', 'lost'));
    await t.settle();
    [...t.el().querySelectorAll('button')]
      .find((b) => b.textContent?.includes('Post count'))
      ?.click();
    const reasons = t.backend.expectOne('/api/v1/stock/counts/c1/reasons');
    expect(reasons.request.body).toEqual({
      lines: [{ lineId: 'cl1', reason: 'lost', note: 'not on the van' }],
    });
    reasons.flush(count('submitted', 'lost'));
    t.backend.expectOne('/api/v1/stock/counts/c1/post').flush(count('posted', 'lost'));
    await t.settle();
    expect(cells().at(-1)).toBe('Lost or missing — not on the van');
  });
});
