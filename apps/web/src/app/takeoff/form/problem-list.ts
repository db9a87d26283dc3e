import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { FloorEditor } from '../floor-editor.store';
import type { Section } from '../model/problem-text';

/**
 * The problems of one part of the form, right under it. Polite, not assertive: they change
 * with every keystroke while a person types, and shouting each one would drown the typing.
 */
@Component({
  selector: 'lw-problem-list',
  imports: [MatIcon],
  template: `
    <div aria-live="polite">
      @for (p of mine(); track $index) {
        <p class="problem"><mat-icon aria-hidden="true">error</mat-icon>{{ p.text }}</p>
      }
    </div>
  `,
  styles: `
    .problem {
      display: flex;
      gap: 6px;
      align-items: center;
      margin: 4px 0;
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProblemList {
  readonly section = input.required<Section>();
  private readonly editor = inject(FloorEditor);
  protected readonly mine = computed(() =>
    this.editor.problems().filter((p) => p.section === this.section()),
  );
}
