import { Directive, ElementRef, forwardRef, inject } from '@angular/core';
import { NG_VALUE_ACCESSOR, type ControlValueAccessor } from '@angular/forms';

/**
 * A number typed into a plain text field, so a minus sign can always be typed: many phones'
 * decimal keypads have none. Accepts "−" (U+2212) and a decimal comma; anything else that is not
 * a number becomes NaN, which the form's `finiteNumber` validator refuses with a message.
 */
export function parseSignedNumber(text: string): number | null {
  const t = text.trim().replace(/\u2212/g, '-').replace(',', '.');
  if (t === '') return null;
  return /^[-+]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number(t) : Number.NaN;
}

/** Writes and reads a numeric form control through a text input (see `parseSignedNumber`). */
@Directive({
  selector: 'input[hlSignedNumber]',
  host: { type: 'text', autocomplete: 'off', '(input)': 'typed()', '(blur)': 'touched()' },
  providers: [{ provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => SignedNumberInput), multi: true }],
})
export class SignedNumberInput implements ControlValueAccessor {
  private readonly el = inject<ElementRef<HTMLInputElement>>(ElementRef);
  private onChange: (value: number | null) => void = () => undefined;
  private onTouched: () => void = () => undefined;

  writeValue(value: number | null): void {
    // Keep what the person is typing ("-", "12.") when the control already holds its value.
    const shown = parseSignedNumber(this.el.nativeElement.value);
    if (value === null || value === undefined) {
      if (shown !== null && !Number.isNaN(shown)) this.el.nativeElement.value = '';
      return;
    }
    if (shown !== value) this.el.nativeElement.value = String(value);
  }

  registerOnChange(fn: (value: number | null) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.el.nativeElement.disabled = disabled;
  }

  protected typed(): void {
    this.onChange(parseSignedNumber(this.el.nativeElement.value));
  }

  protected touched(): void {
    this.onTouched();
  }
}
