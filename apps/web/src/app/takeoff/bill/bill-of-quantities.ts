import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { type TakeoffWarning, ft2FromM2 } from '@latchwork/takeoff';
import { FloorEditor } from '../floor-editor.store';
import { colourFill } from '../model/colour-fill';
import { formatLength } from '../model/lengths';

const whole = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const one = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });
const two = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });

/**
 * The bill of quantities of the current takeoff: areas, tiles per colour, cuts, edges,
 * adhesive and levelling materials, labour and every warning, with the safety cautions for
 * the materials. Dimmed while the floor as entered has problems (it is the last good one).
 */
@Component({
  selector: 'lw-bill-of-quantities',
  imports: [MatButton, MatIcon],
  templateUrl: './bill-of-quantities.html',
  styleUrl: './bill-of-quantities.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BillOfQuantities {
  protected readonly editor = inject(FloorEditor);
  protected readonly r = this.editor.result;
  protected readonly whole = whole;
  protected readonly one = one;
  protected readonly two = two;

  protected readonly colours = computed(
    () => this.r()?.tiles.byColour.map((c) => ({ ...c, fill: colourFill(c.colour) })) ?? [],
  );
  protected readonly warnings = computed(() =>
    (this.r()?.warnings ?? []).map((w) => ({ ...w, suggested: suggestedOrigin(w) })),
  );

  protected area(m2: number): string {
    return this.editor.units() === 'imperial'
      ? `${whole.format(ft2FromM2(m2))} ft²`
      : `${two.format(m2)} m²`;
  }

  protected len(mm: number): string {
    return formatLength(mm, this.editor.units());
  }

  protected useOrigin(at: { x: number; y: number }): void {
    this.editor.update((f) => ({ ...f, origin: { mode: 'point', x: at.x, y: at.y } }));
  }
}

function suggestedOrigin(w: TakeoffWarning): { x: number; y: number } | null {
  const s = w.data?.['suggestedOrigin'];
  if (typeof s !== 'object' || s === null) return null;
  const { x, y } = s as { x: unknown; y: unknown };
  return typeof x === 'number' && typeof y === 'number' ? { x, y } : null;
}
