import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { FloorEditor } from './floor-editor.store';

/** Metric or imperial entry for the floor being edited (lengths stay in mm inside). */
@Component({
  selector: 'lw-units-toggle',
  imports: [MatButtonToggle, MatButtonToggleGroup],
  template: `<mat-button-toggle-group
    aria-label="Units"
    [value]="editor.units()"
    (change)="editor.setUnits($event.value)"
  >
    <mat-button-toggle value="metric">Metric</mat-button-toggle>
    <mat-button-toggle value="imperial">Imperial</mat-button-toggle>
  </mat-button-toggle-group>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitsToggle {
  protected readonly editor = inject(FloorEditor);
}
