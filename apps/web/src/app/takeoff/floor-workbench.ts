import {
  ChangeDetectionStrategy,
  Component,
  ViewEncapsulation,
  inject,
  input,
} from '@angular/core';
import {
  MatExpansionPanel,
  MatExpansionPanelContent,
  MatExpansionPanelHeader,
  MatExpansionPanelTitle,
} from '@angular/material/expansion';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { BillOfQuantities } from './bill/bill-of-quantities';
import { FloorEditor } from './floor-editor.store';
import { FloorFeatures } from './form/floor-features';
import { LayoutSettings } from './form/layout-settings';
import { OutlineEditor } from './form/outline-editor';
import { ProblemList } from './form/problem-list';
import { FloorPlan } from './plan/floor-plan';
import { FirmRatesPanel } from './rates/firm-rates-panel';

/**
 * The floor editor's working area: the form beside the plan and the bill of quantities. It
 * edits the FloorEditor its host provides, so the Takeoff page and a survey area's page
 * (which opens a saved floor and saves versions) share one editor.
 */
@Component({
  selector: 'lw-floor-workbench',
  imports: [
    BillOfQuantities,
    FirmRatesPanel,
    FloorFeatures,
    FloorPlan,
    LayoutSettings,
    MatExpansionPanel,
    MatExpansionPanelContent,
    MatExpansionPanelHeader,
    MatExpansionPanelTitle,
    MatFormField,
    MatInput,
    MatLabel,
    OutlineEditor,
    ProblemList,
  ],
  templateUrl: './floor-workbench.html',
  // Not encapsulated: the host page's print rules reshape this grid (see takeoff-page.scss).
  styleUrl: './floor-workbench.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FloorWorkbench {
  private readonly editor = inject(FloorEditor);
  protected readonly floor = this.editor.floor;
  /** Shows the firm's rates panel (the owner, on the Takeoff page). */
  readonly showRates = input(false);

  protected rename(e: Event): void {
    const name = (e.target as HTMLInputElement).value;
    this.editor.update((f) => ({ ...f, name }));
  }
}
