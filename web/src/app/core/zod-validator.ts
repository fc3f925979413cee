import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';
import { safeParsePlain } from '../../../../shared/schemas/plain-issue-message';

/**
 * A form validator from a shared zod schema, so a field shows the same sentence the server would answer with.
 * The error is `{ schema: message }`.
 */
export function zodValidator(schema: z.ZodType): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const result = safeParsePlain(schema, control.value);
    return result.success ? null : { schema: result.error.issues[0]?.message ?? 'Check this value.' };
  };
}
