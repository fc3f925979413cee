import { FormBuilder } from '@angular/forms';
import * as z from 'zod';
import { fieldMessage, schemaIssues, showIssues } from './schema-issues';

const schema = z.object({
  name: z.string().min(1, 'Give it a name.'),
  sizes: z.object({ max: z.number().max(12, 'At most 12.') }),
  list: z.array(z.string()).min(1, 'Choose one.'),
});

describe('schemaIssues and showIssues', () => {
  it('puts each message on the control at its path and returns the ones without a control', () => {
    const form = new FormBuilder().nonNullable.group({ name: [''], sizes: new FormBuilder().nonNullable.group({ max: [20] }) });
    const issues = schemaIssues(schema, { ...form.getRawValue(), list: [] });
    expect(issues).toEqual({ name: 'Give it a name.', 'sizes.max': 'At most 12.', list: 'Choose one.' });

    const unplaced = showIssues(form, issues);
    expect(fieldMessage(form.get('name'))).toBe('Give it a name.');
    expect(fieldMessage(form.get('sizes.max'))).toBe('At most 12.');
    expect(unplaced).toEqual({ list: 'Choose one.' });
  });

  it('clears a message once the value is right', () => {
    const form = new FormBuilder().nonNullable.group({ name: [''] });
    showIssues(form, { name: 'Give it a name.' });
    form.controls.name.setValue('Rig');
    showIssues(form, {});
    expect(form.controls.name.valid).toBe(true);
  });
});
