import {
  Directive,
  ElementRef,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { type BareUnit, type Units, formatLengthInput, parseLength } from './model/lengths';

/**
 * A text input that holds a length: people type `6000`, `6.5 m` or `19' 8"`, the floor gets
 * millimetres. While the field has focus its text is left as typed (re-formatting under the
 * cursor fights the typist); it is written out neatly on blur and whenever the value changes
 * elsewhere. Unreadable text marks the field invalid and changes nothing.
 */
@Directive({
  selector: 'input[lwLength]',
  exportAs: 'lwLength',
  host: {
    type: 'text',
    inputmode: 'decimal',
    autocomplete: 'off',
    spellcheck: 'false',
    // Not aria-invalid: matInput owns that attribute; templates show `invalid()` as a hint.
    '[class.length-unreadable]': 'invalid()',
    '(input)': 'onInput()',
    '(blur)': 'onBlur()',
  },
})
export class LengthInput {
  /** The length in mm. */
  readonly lwLength = input.required<number>();
  readonly units = input.required<Units>();
  /** What a bare number means; floor lengths default to mm / feet. */
  readonly bare = input<BareUnit | undefined>(undefined);
  /** Smallest length accepted (e.g. 0 for sizes); below it the field is invalid. */
  readonly min = input<number>(-Infinity);
  readonly lengthChange = output<number>();

  /** The text cannot be read as a length (the floor keeps the last good value). */
  readonly invalid = signal(false);
  private readonly el = inject<ElementRef<HTMLInputElement>>(ElementRef).nativeElement;

  constructor() {
    effect(() => {
      const mm = this.lwLength();
      const units = this.units();
      untracked(() => {
        if (document.activeElement !== this.el) this.write(mm, units);
      });
    });
  }

  protected onInput(): void {
    const mm = this.read();
    this.invalid.set(mm === null);
    if (mm !== null && mm !== this.lwLength()) this.lengthChange.emit(mm);
  }

  protected onBlur(): void {
    if (this.read() !== null) this.write(this.lwLength(), this.units());
  }

  private read(): number | null {
    const mm = parseLength(this.el.value, this.units(), this.bare());
    return mm === null || !Number.isFinite(mm) || mm < this.min() ? null : mm;
  }

  private write(mm: number, units: Units): void {
    this.el.value = formatLengthInput(mm, units);
    this.invalid.set(false);
  }
}
