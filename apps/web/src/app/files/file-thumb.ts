import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
} from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { FileApi, type StoredFile } from './file-api';
import { fileIcon } from './file-checks';

/**
 * A file's thumbnail through its short-lived link, or an icon for its kind (also when the
 * image cannot be shown: an expired link, or a page policy that refuses the store's origin).
 */
@Component({
  selector: 'lw-file-thumb',
  imports: [MatIcon],
  template: `@if (src(); as url) {
      <img
        class="thumb"
        [src]="url"
        alt=""
        width="56"
        height="56"
        loading="lazy"
        (error)="src.set(null)"
      />
    } @else {
      <mat-icon class="thumb thumb--icon" aria-hidden="true">{{ icon() }}</mat-icon>
    }`,
  styles: `
    .thumb {
      display: block;
      width: 56px;
      height: 56px;
      border-radius: var(--mat-sys-corner-small);
      object-fit: cover;
      background: var(--mat-sys-surface-container-high);
    }
    .thumb--icon {
      font-size: 32px;
      line-height: 56px;
      text-align: center;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FileThumb {
  private readonly api = inject(FileApi);
  readonly file = input.required<StoredFile>();
  protected readonly src = signal<string | null>(null);
  protected readonly icon = computed(() => fileIcon(this.file().contentType));

  constructor() {
    effect(() => {
      const file = this.file();
      this.src.set(null);
      if (file.hasThumbnail)
        this.api.link(file.id, 'thumbnail').then(
          (url) => this.src.set(url),
          // No thumbnail link: the icon stands in.
          () => this.src.set(null),
        );
    });
  }
}
