import {
  ChangeDetectionStrategy,
  Component,
  ViewEncapsulation,
  computed,
  inject,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import {
  MatExpansionPanel,
  MatExpansionPanelContent,
  MatExpansionPanelHeader,
  MatExpansionPanelTitle,
} from '@angular/material/expansion';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { Session } from '../session/session.store';
import { BillOfQuantities } from './bill/bill-of-quantities';
import { FloorEditor } from './floor-editor.store';
import { FloorFeatures } from './form/floor-features';
import { LayoutSettings } from './form/layout-settings';
import { OutlineEditor } from './form/outline-editor';
import { ProblemList } from './form/problem-list';
import type { Units } from './model/lengths';
import { FloorPlan } from './plan/floor-plan';
import { FirmRatesPanel } from './rates/firm-rates-panel';

/**
 * The floor editor: the form (primary input) beside the plan and the bill of quantities,
 * recomputed live in the browser. Prints as plan plus bill on A4 (takeoff-print.scss).
 */
@Component({
  selector: 'lw-takeoff-page',
  imports: [
    BillOfQuantities,
    FirmRatesPanel,
    FloorFeatures,
    FloorPlan,
    LayoutSettings,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatExpansionPanel,
    MatExpansionPanelContent,
    MatExpansionPanelHeader,
    MatExpansionPanelTitle,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    OutlineEditor,
    ProblemList,
  ],
  providers: [FloorEditor],
  templateUrl: './takeoff-page.html',
  // The print rules reach outside the page (they hide the app's bars), hence no encapsulation;
  // every selector in it is scoped under lw-takeoff-page or a print media query.
  styleUrl: './takeoff-page.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TakeoffPage {
  protected readonly editor = inject(FloorEditor);
  private readonly session = inject(Session);
  protected readonly floor = this.editor.floor;
  protected readonly isOwner = computed(() => this.session.activeTenant()?.role === 'owner');
  protected readonly problemCount = computed(() => this.editor.problems().length);

  protected setUnits(units: Units): void {
    this.editor.setUnits(units);
  }

  protected rename(e: Event): void {
    const name = (e.target as HTMLInputElement).value;
    this.editor.update((f) => ({ ...f, name }));
  }

  protected newFloor(): void {
    this.editor.newFloor();
  }

  protected print(): void {
    window.print();
  }
}
