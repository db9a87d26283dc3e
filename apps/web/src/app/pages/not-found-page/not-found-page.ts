import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';

/** Shown for any address the route table does not know. */
@Component({
  selector: 'lw-not-found-page',
  imports: [MatButton, MatIcon, RouterLink],
  templateUrl: './not-found-page.html',
  styleUrl: './not-found-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {
  /** The address as typed, so the person can spot a typo or an old bookmark. */
  protected readonly address = inject(Router).url;
}
