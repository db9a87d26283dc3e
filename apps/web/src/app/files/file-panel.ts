import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** What a file can belong to. */
export type FileOwnerKind = 'job' | 'site' | 'customer';

/** Upload, list and open the files of a job, site or customer. */
@Component({
  selector: 'lw-file-panel',
  template: `<section class="lw-file-panel" aria-label="Files"><h2>Files</h2></section>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilePanel {
  /** The kind of record the files belong to. */
  readonly ownerKind = input.required<FileOwnerKind>();
  /** The id of that record. */
  readonly ownerId = input.required<string>();
}
