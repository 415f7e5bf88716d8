import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import type { HttpRequest } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestKey } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import type { ProjectDto } from '../../../../shared/schemas/project.schema';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { project } from '../../../../test/support/project-fixture';
import { PICKER_SIZE, ProjectPicker } from './project-picker';

const answer = (items: ProjectDto[], total: number) => ({ items, total, page: 0, size: PICKER_SIZE });
const firstPage = Array.from({ length: PICKER_SIZE }, (_, i) => project(i + 1));

@Component({
  imports: [ProjectPicker],
  template: `<tt-project-picker [value]="value()" (picked)="value.set($event); picks.push($event)" />`,
})
class Host {
  readonly value = signal<number | null>(null);
  readonly picks: (number | null)[] = [];
}

async function open() {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
  });
  const fixture = TestBed.createComponent(Host);
  const http = TestBed.inject(HttpTestingController);
  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    TestBed.tick();
    fixture.detectChanges();
  };
  /** Waits for the request the picker sends (a search waits for a pause in typing): a condition, not a time. */
  const request = async (matches: (r: HttpRequest<unknown>) => boolean): Promise<TestRequest> => {
    for (;;) {
      await settle();
      const found = http.match(matches);
      if (found.length) return found[0];
    }
  };
  await settle();
  return { fixture, http, settle, request, loader: TestbedHarnessEnvironment.documentRootLoader(fixture) };
}

/**
 * Types `text` as one input event. Key by key, a busy machine can take longer than the search's pause between two
 * keys: a search for the first letters then goes out, and the next key's harness call waits for it for ever.
 */
async function typeAll(picker: MatAutocompleteHarness, text: string): Promise<void> {
  await picker.focus();
  const field = await picker.host();
  await field.setInputValue(text);
  await field.dispatchEvent('input');
}

const isList = (q: string) => (r: HttpRequest<unknown>) => r.url === '/api/projects' && (r.params.get('q') ?? '') === q;

describe('the project picker', () => {
  it('when an office has more projects than one answer holds, then typing finds any of them and says how many more', async () => {
    const d = await open();
    (await d.request(isList(''))).flush(answer(firstPage, 240));
    await d.settle();
    const picker = await d.loader.getHarness(MatAutocompleteHarness);
    const field = await d.loader.getHarness(MatFormFieldHarness);
    expect(await field.getTextHints()).toEqual([]); // no list shown yet, so nothing says what it shows
    await picker.focus();
    const before = await Promise.all((await picker.getOptions()).map((o) => o.getText()));

    expect(before).toContain('215 more — type to narrow');
    expect(before).not.toContain('KF-0201 · Kestrel Fen line 201');
    expect(await field.getTextHints()).toEqual(['Showing 25 of 240: type a code or name']);

    await typeAll(picker, 'KF-0201');
    (await d.request(isList('KF-0201'))).flush(answer([project(201)], 1));
    await d.settle();
    await picker.selectOption({ text: 'KF-0201 · Kestrel Fen line 201' });
    // The search gives way to the choice: the unfiltered list is read again, for the next time it opens.
    (await d.request(isList(''))).flush(answer(firstPage, 240));
    await d.settle();

    expect(d.fixture.componentInstance.picks).toEqual([201]);
    expect(await picker.getValue()).toBe('KF-0201 · Kestrel Fen line 201');
    expect(await picker.isOpen()).toBe(false);
    expect(await field.getTextHints()).toEqual([]);
  });

  it('when the chosen project is past the first answer, then it is read by id, offered and counted once', async () => {
    const d = await open();
    d.fixture.componentInstance.value.set(230);
    (await d.request((r) => r.url === '/api/projects/230')).flush(project(230));
    (await d.request(isList(''))).flush(answer(firstPage, 240));
    await d.settle();
    const picker = await d.loader.getHarness(MatAutocompleteHarness);
    const field = await d.loader.getHarness(MatFormFieldHarness);

    expect(await picker.getValue()).toBe('KF-0230 · Kestrel Fen line 230');
    await picker.focus();
    const offered = await Promise.all((await picker.getOptions()).map((o) => o.getText()));
    expect(offered.slice(0, 3)).toEqual([
      'All projects',
      '214 more — type to narrow',
      'KF-0230 · Kestrel Fen line 230',
    ]);
    // 26 project rows: the first answer's 25 and the chosen one, which is one of the 240.
    expect(offered.filter((o) => o.startsWith('KF-'))).toHaveLength(26);
    expect(await field.getTextHints()).toEqual(['Showing 26 of 240: type a code or name']);

    // A search lists what the server found, so the rows and the count agree.
    await typeAll(picker, 'line 1');
    // Of projects 1–240, 111 have 'line 1' in their names (1, 10–19, 100–199); the first answer lists 25.
    const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);
    const lineOne = [1, ...range(10, 19), ...range(100, 113)].map(project);
    (await d.request(isList('line 1'))).flush(answer(lineOne, 111));
    await d.settle();
    const searched = await Promise.all((await picker.getOptions()).map((o) => o.getText()));
    expect(searched.filter((o) => o.startsWith('KF-'))).toHaveLength(25);
    expect(searched).not.toContain('KF-0230 · Kestrel Fen line 230');
    expect(searched).toContain('86 more — type to narrow');
    expect(await field.getTextHints()).toEqual(['Showing 25 of 111: type a code or name']);
  });

  it('when a search is typed but nothing is chosen, then leaving the list shows the chosen project again', async () => {
    const d = await open();
    (await d.request(isList(''))).flush(answer(firstPage, 240));
    await d.settle();
    const picker = await d.loader.getHarness(MatAutocompleteHarness);
    await typeAll(picker, 'zzz');
    (await d.request(isList('zzz'))).flush(answer([], 0));
    await d.settle();

    const offered = await Promise.all((await picker.getOptions()).map((o) => o.getText()));
    expect(offered).toEqual(['All projects', 'No project matches “zzz”']);
    await (await picker.host()).sendKeys(TestKey.ESCAPE);
    await d.settle();
    expect(await picker.getValue()).toBe('');
    expect(d.fixture.componentInstance.picks).toEqual([]);
  });
});
