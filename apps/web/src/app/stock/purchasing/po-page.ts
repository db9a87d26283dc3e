import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
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

/**
 * One purchase order: its lines and totals, the PDF, sending and cancelling, and goods in —
 * per line what arrived (packs + loose units), its batch and expiry, what arrived damaged and
 * what the supplier actually charged.
 */
@Component({
  selector: 'lw-po-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
  ],
  templateUrl: './po-page.html',
  styleUrl: '../stock-page.scss',
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
  protected readonly goods = new FormGroup({
    receivedOn: new FormControl('', { nonNullable: true }),
    note: new FormControl('', { nonNullable: true }),
    lines: new FormArray<ReturnType<typeof goodsRow>>([]),
  });

  constructor() {
    this.api.get(this.id).subscribe({
      next: (o) => this.show(o),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  private show(o: Order): void {
    this.order.set(o);
    this.goods.controls.lines.clear();
    for (const _ of o.lines) this.goods.controls.lines.push(goodsRow());
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
    const lines: GoodsInLine[] = (this.order()?.lines ?? []).flatMap((l, i) => {
      const r = v.lines[i];
      if (!r.packs && !r.units && !r.damaged) return [];
      const cost = moneyInput(r.unitCost, this.currency());
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
    });
    if (lines.length === 0) return this.problem.set('Enter what arrived on at least one line.');
    // The API names lines by their place in what was sent; the form by the order's lines.
    const rename: Record<string, string> = {};
    lines.forEach((g, i) => {
      const at = (this.order()?.lines ?? []).findIndex((l) => l.id === g.purchaseOrderLineId);
      for (const f of ['packs', 'units', 'damaged', 'batchCode', 'expiresOn', 'unitCostMinor'])
        rename[`lines.${i}.${f}`] = `lines.${at}.${f === 'unitCostMinor' ? 'unitCost' : f}`;
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
