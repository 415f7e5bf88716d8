import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { MatCheckboxModule, type MatCheckboxChange } from '@angular/material/checkbox';
import type { Checklist } from '../../../../../shared/rules';
import type { ManualItemState, RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { assertApiFailure } from '../../../core/http/api-failure';
import { CalcsApi } from '../calcs-api';

/**
 * The checker's manual items. A tick is a quality record, so the box shows only what the server
 * stored: a refused tick is put back at once and its reason stays beside that item until it changes.
 * One tick at a time: each answer is the whole revision, and two in flight could arrive in either order,
 * leaving the page (and the signing dialog opened from it) with the older one.
 */
@Component({
  selector: 'tt-manual-items',
  imports: [MatCheckboxModule],
  template: `
    <ul class="manual">
      @for (m of rows(); track m.id) {
        <li>
          <mat-checkbox
            [checked]="m.state?.done ?? false"
            [disabled]="!canTick() || busy() !== null"
            (change)="tick(m.id, $event)"
            >{{ m.text }}</mat-checkbox
          >
          @if (m.state?.by) {
            <span class="tt-muted small">{{ m.state?.done ? 'ticked' : 'unticked' }} by {{ m.state?.by }}</span>
          }
          @if (refusals()[m.id]; as why) {
            <p class="refused" role="alert">Not {{ m.state?.done ? 'unticked' : 'ticked' }}: {{ why }}</p>
          }
        </li>
      }
    </ul>
  `,
  styles: `
    .manual {
      list-style: none;
      padding: 0;
      margin: 0;
      li {
        display: flex;
        flex-wrap: wrap;
        align-items: center;
        gap: 0 10px;
      }
    }
    .small {
      font-size: 12px;
    }
    .refused {
      flex-basis: 100%;
      margin: 0 0 6px 40px;
      color: var(--tt-fail);
      font-size: 13px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ManualItems {
  private readonly api = inject(CalcsApi);
  readonly revision = input.required<RevisionDto>();
  readonly canTick = input(false);
  readonly changed = output<RevisionDto>();
  protected readonly busy = signal<string | null>(null);
  protected readonly refusals = signal<Record<string, string>>({});
  protected readonly rows = computed(() => {
    const r = this.revision();
    // An item nobody has ticked yet has no stored state.
    const stateOf = (id: string): ManualItemState | null =>
      Object.hasOwn(r.manualItems, id) ? r.manualItems[id] : null;
    return ((r.checklist as Checklist | null)?.manual ?? []).map((m) => ({ ...m, state: stateOf(m.id) }));
  });

  protected async tick(itemId: string, event: MatCheckboxChange): Promise<void> {
    const done = event.checked;
    this.busy.set(itemId);
    try {
      const stored = await this.api.setManualItem(this.revision().id, itemId, done);
      this.refusals.update(({ [itemId]: _, ...rest }) => rest);
      this.changed.emit(stored);
    } catch (error) {
      // The checkbox toggled itself on click; put it back to what the server holds.
      event.source.checked = !done;
      assertApiFailure(error);
      this.refusals.update((r) => ({ ...r, [itemId]: error.message }));
    } finally {
      this.busy.set(null);
    }
  }
}
