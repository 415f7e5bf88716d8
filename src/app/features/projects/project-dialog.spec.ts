import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { ProjectDto } from '../../../../shared/schemas/project.schema';
import { dialogProviders, mountComponent, refusal } from '../../../../test/support/client-harness';
import { ProjectDialog } from './project-dialog';

const EXISTING = {
  id: 4,
  code: 'KFD-SP450',
  name: 'Spiral conveyor 450',
  client: 'Kestrel Fen Drives',
  description: '',
  revisionScheme: 'letters',
  status: 'active',
  version: 6,
} as unknown as ProjectDto;

async function open(existing: ProjectDto | null) {
  const dialog = dialogProviders(existing);
  const d = await mountComponent(ProjectDialog, { providers: dialog.providers });
  const input = (name: string) =>
    d.loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
  const field = (label: RegExp) => d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const submit = async () =>
    (await d.loader.getHarness(MatButtonHarness.with({ text: existing ? 'Save changes' : 'Create project' }))).click();
  return { ...d, closed: dialog.closed, input, field, submit };
}

describe('the project dialog', () => {
  it('when the code has lower-case letters, then nothing is sent and the code field says what to use', async () => {
    const d = await open(null);
    await (await d.input('code')).setValue('kfd sp');
    await (await d.input('name')).setValue('Spiral conveyor');
    await d.submit();
    await d.settle();

    d.http.expectNone('/api/projects');
    expect(await (await d.field(/Project code/)).getTextErrors()).toEqual([
      'Project code may use capital letters, digits and dashes',
    ]);
  });

  it('when a new project is valid, then it is created with the chosen revision scheme and the dialog closes with it', async () => {
    const d = await open(null);
    await (await d.input('code')).setValue('KFD-SP451');
    await (await d.input('name')).setValue('Spiral conveyor 451');
    const scheme = await d.loader.getHarness(MatSelectHarness);
    await scheme.open();
    await scheme.clickOptions({ text: /Numbers/ });
    await d.submit();

    const req = d.http.expectOne({ method: 'POST', url: '/api/projects' });
    expect(req.request.body).toEqual({
      code: 'KFD-SP451',
      name: 'Spiral conveyor 451',
      client: '',
      description: '',
      revisionScheme: 'numbers',
    });
    req.flush({ ...EXISTING, id: 8, code: 'KFD-SP451' });
    await d.settle();
    expect(d.closed).toEqual([expect.objectContaining({ id: 8 })]);
  });

  it('when a project is edited, then its code is fixed, it can be archived and the stored version is sent', async () => {
    const d = await open(EXISTING);
    expect(await (await d.input('code')).isDisabled()).toBe(true);
    const status = await d.loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="status"]' }));
    await status.open();
    await status.clickOptions({ text: /Archived/ });
    await d.submit();

    const req = d.http.expectOne({ method: 'PATCH', url: '/api/projects/4' });
    expect(req.request.body).toEqual(
      expect.objectContaining({ status: 'archived', version: 6, name: 'Spiral conveyor 450' }),
    );
    expect(req.request.body.code).toBeUndefined();
  });

  it('when the server says the stored project moved on, then its message shows and the dialog stays open', async () => {
    const d = await open(EXISTING);
    await d.submit();
    d.http
      .expectOne({ method: 'PATCH', url: '/api/projects/4' })
      .flush(...refusal(409, 'Someone else changed this project; reopen it'));
    await d.settle();

    expect(d.alerts()).toEqual(['Someone else changed this project; reopen it']);
    expect(d.closed).toEqual([]);
  });
});
