import { FormBuilder } from '@angular/forms';

import { PASSWORD_MIN_LENGTH, newPasswordGroup } from './password-rules';

describe('password rules', () => {
  const group = () => newPasswordGroup(new FormBuilder().nonNullable);

  it('should refuse a password one character too short', () => {
    const form = group();
    form.setValue({ password: 'x'.repeat(PASSWORD_MIN_LENGTH - 1), repeat: 'x'.repeat(PASSWORD_MIN_LENGTH - 1) });
    expect(form.controls.password.hasError('minlength')).toBe(true);
  });

  it('should flag two different passwords', () => {
    const form = group();
    form.setValue({ password: 'green petiole stripe', repeat: 'green petiole strip' });
    expect(form.hasError('passwordsDiffer')).toBe(true);
  });

  it('should accept a long password typed twice alike', () => {
    const form = group();
    form.setValue({ password: 'green petiole stripe', repeat: 'green petiole stripe' });
    expect(form.valid).toBe(true);
  });
});
