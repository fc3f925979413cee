import type { AbstractControl } from '@angular/forms';
import type { z } from 'zod';
import { safeParsePlain } from '../../../../shared/schemas/plain-issue-message';

/**
 * The problems a shared schema finds in a value, keyed by dotted path (`coordinates.0.column`) exactly as the
 * server keys `fields` in its error answer, so one form can show both next to the same field.
 */
export function schemaIssues(schema: z.ZodType, value: unknown): Record<string, string> {
  const result = safeParsePlain(schema, value);
  if (result.success) return {};
  const issues: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '';
    issues[key] ??= issue.message;
  }
  return issues;
}

/**
 * Puts each message on the form control at its path (as the error `schema`) and clears the ones that no longer
 * apply. Paths without a control are returned, so the page can show them above the form.
 */
export function showIssues(form: AbstractControl, issues: Record<string, string>): Record<string, string> {
  const unplaced: Record<string, string> = { ...issues };
  visit(form, '', (control, path) => {
    const message = issues[path];
    const { schema: _old, ...others } = control.errors ?? {};
    if (message !== undefined) {
      control.setErrors({ ...others, schema: message }, { emitEvent: false });
      delete unplaced[path];
    } else if (control.errors && 'schema' in control.errors) {
      control.setErrors(Object.keys(others).length ? others : null, { emitEvent: false });
    }
  });
  return unplaced;
}

function visit(control: AbstractControl, path: string, each: (control: AbstractControl, path: string) => void): void {
  const children = (control as { controls?: Record<string, AbstractControl> | AbstractControl[] }).controls;
  if (children === undefined) {
    each(control, path);
    return;
  }
  each(control, path);
  const entries = Array.isArray(children) ? children.map((c, i) => [String(i), c] as const) : Object.entries(children);
  for (const [key, child] of entries) visit(child, path ? `${path}.${key}` : key, each);
}

/** The message to show under a field: the server's or the schema's. */
export function fieldMessage(control: AbstractControl | null): string {
  const errors = control?.errors ?? {};
  return String(errors['server'] ?? errors['schema'] ?? '');
}
