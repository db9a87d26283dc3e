import {
  ChangeDetectionStrategy,
  Component,
  ViewEncapsulation,
  computed,
  inject,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { Session } from '../session/session.store';
import { FloorEditor } from './floor-editor.store';
import { FloorWorkbench } from './floor-workbench';
import { UnitsToggle } from './units-toggle';

/**
 * The floor editor: the form (primary input) beside the plan and the bill of quantities
 * (the workbench), recomputed live in the browser. Prints as plan plus bill on A4 (takeoff-print.scss).
 */
@Component({
  selector: 'lw-takeoff-page',
  imports: [FloorWorkbench, MatButton, MatIcon, UnitsToggle],
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
  protected readonly isOwner = computed(() => this.session.activeTenant()?.role === 'owner');
  protected readonly problemCount = computed(() => this.editor.problems().length);

  protected newFloor(): void {
    this.editor.newFloor();
  }

  protected print(): void {
    window.print();
  }
}
