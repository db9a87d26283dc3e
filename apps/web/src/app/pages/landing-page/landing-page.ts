import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { Session } from '../../session/session.store';
import { safePath } from '../../session/sign-in-link';
import { signInNotice } from './sign-in-notice';

/** One thing Latchwork does, in the words a flooring contractor uses. */
interface Feature {
  readonly icon: string;
  readonly title: string;
  readonly text: string;
}

/** Who works in Latchwork, and what for. */
interface Role {
  readonly name: string;
  readonly work: string;
}

/** The signed-out front page: what Latchwork does for a flooring firm, and the way in. */
@Component({
  selector: 'lw-landing-page',
  imports: [MatButton, MatIcon, RouterLink],
  templateUrl: './landing-page.html',
  styleUrl: './landing-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LandingPage {
  private readonly session = inject(Session);
  private readonly query = toSignal(inject(ActivatedRoute).queryParamMap, { requireSync: true });

  /** The page a guard turned the person away from, or where their session ended. */
  private readonly returnTo = computed(
    () => this.session.returnTo() ?? safePath(this.query().get('returnTo')),
  );

  protected readonly signInLink = computed(() => this.session.signInLink(this.returnTo() ?? '/'));

  /** Why the person is here: a session that ended, a failed sign-in, or a page that needs one. */
  protected readonly notice = computed(() =>
    signInNotice({
      sessionEnded: this.session.signedOutReason() === 'session-ended',
      failure: this.query().get('signin'),
      returnTo: this.returnTo(),
    }),
  );

  protected readonly features: readonly Feature[] = [
    {
      icon: 'straighten',
      title: 'Enquiries and site surveys',
      text: 'Book the survey, measure every area with its columns, steps and doorways, mark hot spots that need adhesive, record the slab moisture and temperature, and keep the photos with the job.',
    },
    {
      icon: 'grid_on',
      title: 'Takeoffs',
      text: 'Tiles per colour with full and cut counts, a layout that avoids thin slivers at the walls, offcuts reused, edge ramps, corners, adhesive, primer and the hours to fit it.',
    },
    {
      icon: 'request_quote',
      title: 'Quotes and deposits',
      text: 'Price the job at a margin you can live with, send the quote, get it accepted online and take the deposit.',
    },
    {
      icon: 'inventory_2',
      title: 'Stock and batches',
      text: 'Reserve tiles from one production batch per colour, order what is short, and know what sits in the warehouse, on the vans and on site.',
    },
    {
      icon: 'engineering',
      title: 'Crews and job sheets',
      text: 'Book the fitting dates and hand the crew a job sheet with the layout, materials and safety cautions; they send back time, materials used and photos.',
    },
    {
      icon: 'receipt_long',
      title: 'Invoices and chasing',
      text: 'Deposit, stage and final invoices with retention on commercial work, card or bank payments, reminders and late-payment interest for slow payers.',
    },
  ];

  protected readonly roles: readonly Role[] = [
    { name: 'Owner', work: 'margins, pipeline, cash owed and approvals' },
    { name: 'Estimator', work: 'customers, sites, surveys, takeoffs and quotes' },
    { name: 'Stores', work: 'stock, batches, counts, purchase orders and goods in' },
    { name: 'Bookkeeper', work: 'invoices, payments, credit notes and statements' },
    { name: 'Installer', work: 'the day’s job sheet, time, materials and photos from site' },
  ];
}
