import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink, RouterLinkActive } from '@angular/router';
import { NavItem } from './nav-items';

/**
 * The main navigation: icon above a short label in the rail, icon beside the label in the
 * drawer. The API reference is a plain link because the API serves it, not the router. No
 * ripple: importing it from `@angular/material/core` drags that whole barrel (options,
 * checkboxes, error states the lazy pages use) into the initial bundle; a hover tint does.
 */
@Component({
  selector: 'lw-nav-list',
  imports: [RouterLink, RouterLinkActive, MatIcon],
  templateUrl: './nav-list.html',
  styleUrl: './nav-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    class: 'nav',
    '[class.nav--rail]': "layout() === 'rail'",
    '[class.nav--drawer]': "layout() === 'drawer'",
  },
})
export class NavList {
  readonly items = input.required<readonly NavItem[]>();
  readonly layout = input<'rail' | 'drawer'>('rail');
}
