import {
  AbstractControl,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ValidationErrors,
  ValidatorFn,
  Validators,
} from '@angular/forms';

import { PASSWORD_MIN_LENGTH } from '../../../../shared/api/roles.js';

export { PASSWORD_MIN_LENGTH };

/** A new password typed twice. */
export type NewPasswordGroup = FormGroup<{ password: FormControl<string>; repeat: FormControl<string> }>;

/** Validators for a new password, matching the server's rule (length, not complexity). */
export const NEW_PASSWORD_VALIDATORS: ValidatorFn[] = [
  Validators.required,
  Validators.minLength(PASSWORD_MIN_LENGTH),
  Validators.maxLength(200),
];

/** A group validator: the `repeat` control must equal the `password` control. */
export function passwordsMatch(passwordKey = 'password', repeatKey = 'repeat'): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const password = group.get(passwordKey)?.value as string | undefined;
    const repeat = group.get(repeatKey)?.value as string | undefined;
    return repeat && password !== repeat ? { passwordsDiffer: true } : null;
  };
}

/** The form group for a new password typed twice. */
export function newPasswordGroup(fb: NonNullableFormBuilder): NewPasswordGroup {
  return fb.group(
    { password: ['', NEW_PASSWORD_VALIDATORS], repeat: ['', Validators.required] },
    { validators: passwordsMatch() },
  );
}
