import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { ReadingStatus } from '@latchwork/jobs-domain';

const LOOK: Readonly<Record<ReadingStatus, { icon: string; label: string }>> = {
  pass: { icon: 'check_circle', label: 'Pass' },
  warn: { icon: 'warning', label: 'Warn' },
  fail: { icon: 'cancel', label: 'Fail' },
};

/** Pass / warn / fail for a reading: an icon and a word, so colour is never the only cue. */
@Component({
  selector: 'lw-status-chip',
  imports: [MatIcon],
  template: `<span class="chip chip--{{ status() }}"
    ><mat-icon aria-hidden="true">{{ look().icon }}</mat-icon
    >{{ look().label }}</span
  >`,
  styles: `
    .chip {
      display: inline-flex;
      gap: 4px;
      align-items: center;
      padding: 2px 10px 2px 6px;
      border-radius: 999px;
      font: var(--mat-sys-label-large);
      white-space: nowrap;
    }
    .chip mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .chip--pass {
      background: var(--mat-sys-surface-container-high);
      color: var(--mat-sys-on-surface);
    }
    .chip--warn {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .chip--fail {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusChip {
  readonly status = input.required<ReadingStatus>();
  protected readonly look = computed(() => LOOK[this.status()]);
}
