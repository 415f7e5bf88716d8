import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';
import type { ProjectDto } from '../../../../shared/schemas/project.schema';
import { loadFailureText } from '../../ui/load-failure';
import { ProjectsApi } from './projects-api';

/** How many matches one answer lists; more are reached by typing, never by a longer list. */
export const PICKER_SIZE = 25;
/** Waits for a pause in typing, so a word is one request, not one per letter. */
export const PICKER_DEBOUNCE_MS = 250;

const projectText = (p: ProjectDto | string | null) => (typeof p === 'string' ? p : p ? `${p.code} · ${p.name}` : '');

/**
 * Chooses one project (or all) out of any number: typing searches code and name on the server, the answer
 * says how many more there are, and the unfiltered list offers the chosen project even beyond its first answer.
 */
@Component({
  selector: 'tt-project-picker',
  imports: [ReactiveFormsModule, MatAutocompleteModule, MatFormFieldModule, MatInputModule],
  templateUrl: './project-picker.html',
  styles: `
    :host {
      display: block;
    }
    mat-form-field {
      width: 100%;
    }
    .failure {
      color: var(--tt-fail);
    }
    .more {
      font-style: italic;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectPicker {
  private readonly api = inject(ProjectsApi);
  readonly value = input<number | null>(null);
  readonly label = input('Project');
  readonly picked = output<number | null>();

  protected readonly text = new FormControl<ProjectDto | string | null>(null);
  protected readonly typed = toSignal(
    this.text.valueChanges.pipe(
      map((v) => (typeof v === 'string' ? v.trim() : '')),
      debounceTime(PICKER_DEBOUNCE_MS),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  protected readonly matches = this.api.list(computed(() => ({ page: 0, size: PICKER_SIZE, q: this.typed() })));
  private readonly lastPicked = signal<ProjectDto | null>(null);
  /** A project chosen elsewhere (an address, a saved filter) is read by id: it need not be in any answer. */
  private readonly lookup = this.api.one(
    computed(() => (this.value() === null || this.lastPicked()?.id === this.value() ? null : this.value())),
  );
  protected readonly chosen = computed(() => {
    const id = this.value();
    if (id === null) return null;
    if (this.lastPicked()?.id === id) return this.lastPicked();
    return this.lookup.hasValue() && this.lookup.value().id === id ? this.lookup.value() : null;
  });
  protected readonly found = computed(() => (this.matches.hasValue() ? this.matches.value().items : []));
  /**
   * The unfiltered list adds the chosen project when its answer leaves it out: it is then one of the answer's total,
   * so the counts stay exact. A search lists only its answer: whether the chosen project matches is the server's
   * call, and offering it anyway would miscount (or sit beside "No project matches").
   */
  protected readonly options = computed(() => {
    const chosen = this.chosen();
    const add = chosen && this.typed() === '' && !this.found().some((p) => p.id === chosen.id);
    return add ? [chosen, ...this.found()] : this.found();
  });
  /** How many projects there are in all (for the search, if any). */
  protected readonly total = computed(() => (this.matches.hasValue() ? this.matches.value().total : 0));
  /** How many of them the list does not show. */
  protected readonly more = computed(() => Math.max(0, this.total() - this.options().length));
  protected readonly failure = computed(() => {
    const error = this.matches.error() ?? this.lookup.error();
    return error ? loadFailureText(error, 'project list') : null;
  });
  protected readonly display = projectText;
  protected readonly isListOpen = signal(false);

  constructor() {
    effect(() => this.showChosen());
  }

  protected pick(event: MatAutocompleteSelectedEvent): void {
    const project = event.option.value as ProjectDto | null;
    this.lastPicked.set(project);
    if ((project?.id ?? null) !== this.value()) this.picked.emit(project?.id ?? null);
  }

  protected leaveList(): void {
    this.isListOpen.set(false);
    this.showChosen();
  }

  /** Leaving the list without choosing puts back what is chosen: the field never shows a search as a filter. */
  protected showChosen(): void {
    const chosen = this.chosen();
    if (this.text.value !== chosen) this.text.setValue(chosen);
  }

  protected retryIfFailed(): void {
    if (this.matches.error()) this.matches.reload();
    if (this.lookup.error()) this.lookup.reload();
  }
}
