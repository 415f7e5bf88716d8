import { FormControl } from '@angular/forms';
import { createProjectSchema } from '../../../../shared/schemas/project.schema';
import { createUserSchema } from '../../../../shared/schemas/user.schema';
import { schemaValidator } from './schema-validator';

const check = (field: Parameters<typeof schemaValidator>[0], label: string, value: string) =>
  new FormControl(value, { nonNullable: true, validators: schemaValidator(field, label) }).errors;

describe('schemaValidator', () => {
  it.each([
    [
      'a one-letter project code',
      createProjectSchema.shape.code,
      'Project code',
      'K',
      'Project code must be at least 2 characters',
    ],
    [
      'a 33-character project code',
      createProjectSchema.shape.code,
      'Project code',
      'K'.repeat(33),
      'Project code is at most 32 characters',
    ],
    [
      'a lower-case project code',
      createProjectSchema.shape.code,
      'Project code',
      'kfd',
      'Project code may use capital letters, digits and dashes',
    ],
    [
      'a 65-character username',
      createUserSchema.shape.username,
      'Username',
      'a'.repeat(65),
      'Username is at most 64 characters',
    ],
  ])("when the value is %s, then the control carries the server's own words", (_case, field, label, value, message) => {
    expect(check(field, label, value)).toEqual({ schema: message });
  });

  it('when the value passes the shared rule, then the control has no schema error', () => {
    expect(check(createProjectSchema.shape.code, 'Project code', 'KFD-SP450')).toBeNull();
    expect(check(createUserSchema.shape.username, 'Username', 'r.okafor')).toBeNull();
  });
});
