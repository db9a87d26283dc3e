import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { errorText, showProblems } from '../../api/api-problems';
import { Session } from '../../session/session.store';
import { moneyInput, moneyText } from '../stock-format';
import { ORDER_STATUS, PurchasingApi, type GoodsInLine, type Order } from './purchasing-api';

const WHOLE = Validators.pattern(/^\d{0,12}$/);
const goodsRow = () =>
  new FormGroup({
    packs: new FormControl('', { nonNullable: true, validators: WHOLE }),
    units: new FormControl('', { nonNullable: true, validators: WHOLE }),
    damaged: new FormControl('', { nonNullable: true, validators: WHOLE }),
    batchCode: new FormControl('', { nonNullable: true }),
    expiresOn: new FormControl('', { nonNullable: true }),
    unitCost: new FormControl('', { nonNullable: true }),
  });
type GoodsRow = ReturnType<typeof goodsRow>;

/**
 * One purchase order: its lines and totals, the PDF, sending and cancelling, and goods in —
 * per line what arrived (packs + loose units) in one or more batches, each with its code and
 * expiry, what arrived damaged and what the supplier actually charged.
 */
@Component({
  selector: 'lw-po-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatIconButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
  ],
  templateUrl: './po-page.html',
  styleUrls: ['../stock-page.scss', './po-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PoPage {
  private readonly api = inject(PurchasingApi);
  private readonly session = inject(Session);
  private readonly id = inject(ActivatedRoute).snapshot.paramMap.get('purchaseOrderId') ?? '';
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly statusText = ORDER_STATUS;
  protected readonly order = signal<Order | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly pdfUrl = this.api.pdfUrl(this.id);
  protected readonly receiving = computed(() =>
    ['sent', 'part_received'].includes(this.order()?.status ?? ''),
  );
  protected readonly sendForm = new FormGroup({
    to: new FormControl('', { nonNullable: true, validators: Validators.email }),
    message: new FormControl('', { nonNullable: true }),
  });
  protected readonly cancelReason = new FormControl('', { nonNullable: true });
  /** Per order line, one row per batch that arrived (a delivery may mix production runs). */
  protected readonly goods = new FormGroup({
    receivedOn: new FormControl('', { nonNullable: true }),
    note: new FormControl('', { nonNullable: true }),
    lines: new FormArray<FormArray<GoodsRow>>([]),
  });

  constructor() {
    this.api.get(this.id).subscribe({
      next: (o) => this.show(o),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  private show(o: Order): void {
    this.order.set(o);
    this.goods.reset();
    this.goods.controls.lines.clear();
    for (const _ of o.lines) this.goods.controls.lines.push(new FormArray([goodsRow()]));
  }

  /** The batch rows of order line `i`. */
  protected batchesOf(i: number): FormArray<GoodsRow> {
    return this.goods.controls.lines.at(i);
  }

  protected addBatch(i: number): void {
    this.batchesOf(i).push(goodsRow());
  }

  protected removeBatch(i: number, j: number): void {
    this.batchesOf(i).removeAt(j);
  }

  /** One delivery in a line: "2026-12-02 at the yard by Colm: 3 boxes batch A; 2 boxes batch B". */
  protected deliveryText(r: Order['receipts'][number]): string {
    const goods = r.lines.map((g) =>
      [
        g.packs,
        g.damagedQuantity ? `(+${g.damagedPacks} damaged)` : '',
        g.batchCode ? `batch ${g.batchCode}` : '',
        g.expiresOn ? `use by ${g.expiresOn}` : '',
      ]
        .filter(Boolean)
        .join(' '),
    );
    const by = r.receivedByName ? ` by ${r.receivedByName}` : '';
    return `${r.receivedOn} at ${r.locationName}${by}: ${goods.join('; ')}`;
  }

  protected money(minor: number): string {
    return moneyText(minor, this.currency());
  }

  protected send(): void {
    if (this.sendForm.invalid) return this.sendForm.markAllAsTouched();
    const v = this.sendForm.getRawValue();
    this.problem.set(null);
    this.api.send(this.id, { ...(v.to ? { to: v.to } : {}), message: v.message }).subscribe({
      next: (o) => this.show(o),
      error: (err: unknown) => this.problem.set(showProblems(this.sendForm, err)),
    });
  }

  protected cancel(): void {
    const reason = this.cancelReason.value.trim();
    if (!reason) return this.problem.set('Say why the order is cancelled.');
    this.api.cancel(this.id, reason).subscribe({
      next: (o) => this.show(o),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  protected receive(): void {
    if (this.goods.invalid) return this.goods.markAllAsTouched();
    const v = this.goods.getRawValue();
    // Where each line sent came from in the form (order line, batch row), to put refusals back.
    const from: [number, number][] = [];
    const lines: GoodsInLine[] = (this.order()?.lines ?? []).flatMap((l, i) =>
      v.lines[i].flatMap((r, j) => {
        if (!r.packs && !r.units && !r.damaged) return [];
        const cost = moneyInput(r.unitCost, this.currency());
        from.push([i, j]);
        return [
          {
            purchaseOrderLineId: l.id,
            packs: Number(r.packs || 0),
            units: Number(r.units || 0),
            damaged: Number(r.damaged || 0),
            ...(r.batchCode.trim() ? { batchCode: r.batchCode.trim() } : {}),
            ...(r.expiresOn ? { expiresOn: r.expiresOn } : {}),
            ...(cost === null || Number.isNaN(cost) ? {} : { unitCostMinor: cost }),
          },
        ];
      }),
    );
    if (lines.length === 0) return this.problem.set('Enter what arrived on at least one line.');
    const rename: Record<string, string> = {};
    from.forEach(([i, j], k) => {
      for (const f of ['packs', 'units', 'damaged', 'batchCode', 'expiresOn', 'unitCostMinor'])
        rename[`lines.${k}.${f}`] = `lines.${i}.${j}.${f === 'unitCostMinor' ? 'unitCost' : f}`;
    });
    this.problem.set(null);
    this.api
      .receive(this.id, {
        ...(v.receivedOn ? { receivedOn: v.receivedOn } : {}),
        note: v.note,
        lines,
      })
      .subscribe({
        next: (o) => this.show(o),
        error: (err: unknown) => this.problem.set(showProblems(this.goods, err, rename)),
      });
  }
}
