import { HttpClient, HttpContext } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom, map, startWith } from 'rxjs';
import { showProblems } from '../../api/api-problems';
import { SHOW_ERROR_SNACKBAR } from '../../shell/api-error-interceptor';
import { Session } from '../../session/session.store';
import { COMMON_CURRENCIES } from './currencies';
import {
  MAX_ADDRESS_LINES,
  PREFIXES,
  PROBLEM_PATHS,
  TenantSettings,
  addressLine,
  buildSettingsForm,
  errorText,
  fillSettingsForm,
  settingsFromForm,
} from './settings-form';

/** The firm's settings: name, address, money, units, tax, payment terms and document numbers. */
@Component({
  selector: 'lw-settings-page',
  imports: [
    ReactiveFormsModule,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatOption,
    MatRadioButton,
    MatRadioGroup,
    MatSuffix,
  ],
  templateUrl: './settings-page.html',
  styleUrl: './settings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);

  protected readonly form = buildSettingsForm(inject(NonNullableFormBuilder));
  protected readonly prefixes = PREFIXES;
  protected readonly maxLines = MAX_ADDRESS_LINES;
  protected readonly errorText = errorText;
  protected readonly loaded = signal(false);
  protected readonly saving = signal(false);
  /** What the API refused that no single field can show, or why loading failed. */
  protected readonly problem = signal<string | null>(null);

  private readonly currencyText = toSignal(
    this.form.controls.currency.valueChanges.pipe(
      map((v) => v.trim().toUpperCase()),
      startWith(''),
    ),
    { initialValue: '' },
  );
  /** Common codes matching what is typed so far; any other valid code may still be typed. */
  protected readonly currencies = computed(() => {
    const typed = this.currencyText();
    return COMMON_CURRENCIES.filter(
      (c) => c.code.startsWith(typed) || c.name.toUpperCase().includes(typed),
    );
  });

  constructor() {
    void this.load();
  }

  protected get lines() {
    return this.form.controls.addressLines;
  }

  protected addLine(): void {
    if (this.lines.length < MAX_ADDRESS_LINES) this.lines.push(addressLine());
  }

  protected removeLine(index: number): void {
    this.lines.removeAt(index);
    this.lines.markAsDirty();
  }

  /** Currency codes are capitals: what is typed is shown in capitals straight away. */
  protected upperCaseCurrency(): void {
    const control = this.form.controls.currency;
    const upper = control.value.toUpperCase();
    if (upper !== control.value) control.setValue(upper);
  }

  protected async save(): Promise<void> {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    try {
      const saved = await firstValueFrom(
        this.http.put<TenantSettings>('/api/v1/settings', settingsFromForm(this.form), {
          context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false),
        }),
      );
      fillSettingsForm(this.form, saved);
      this.snackBar.open('Settings saved.', undefined, { duration: 4000 });
      // The firm's name and currency also show in the top bar and on Home.
      void this.session.load();
    } catch (err: unknown) {
      this.problem.set(showProblems(this.form, err, PROBLEM_PATHS));
    } finally {
      this.saving.set(false);
    }
  }

  private async load(): Promise<void> {
    try {
      fillSettingsForm(
        this.form,
        await firstValueFrom(this.http.get<TenantSettings>('/api/v1/settings')),
      );
      this.loaded.set(true);
    } catch {
      this.problem.set('The settings could not be loaded. Reload the page to try again.');
    }
  }
}
