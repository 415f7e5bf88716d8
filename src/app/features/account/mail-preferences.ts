import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatSlideToggleModule, type MatSlideToggleChange } from '@angular/material/slide-toggle';
import type { MailPreferenceDto } from '../../../../shared/schemas/mail.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { MailPreferencesApi } from './mail-preferences-api';

/** Per event, whether Torquetrail e-mails you; events for roles you do not hold are listed last. */
@Component({
  selector: 'tt-mail-preferences',
  imports: [MatSlideToggleModule, LoadFailure],
  template: `
    <h2 id="mail-title">E-mail</h2>
    <p class="tt-muted small">
      Torquetrail mails you at each hand-over that concerns you. Turn off what you do not want; the work itself still
      reaches your overview.
    </p>
    @if (resource.error(); as error) {
      <tt-load-failure [error]="error" what="e-mail settings" (retry)="resource.reload()" />
    }
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
    <ul class="events" aria-labelledby="mail-title">
      @for (p of rows(); track p.event) {
        <li>
          <mat-slide-toggle [checked]="p.enabled" [disabled]="saving() === p.event" (change)="toggle(p, $event)">{{
            p.label
          }}</mat-slide-toggle>
          <span class="tt-muted small">{{ p.description }}{{ p.appliesToYou ? '' : ' (not one of your roles)' }}</span>
        </li>
      }
    </ul>
  `,
  styles: `
    h2 {
      margin: 0 0 6px;
      font: var(--mat-sys-title-medium);
    }
    .small {
      font-size: 12px;
    }
    .events {
      list-style: none;
      padding: 0;
      margin: 8px 0 0;
      display: grid;
      gap: 10px;
    }
    li {
      display: grid;
      gap: 2px;
    }
    .problem {
      color: var(--tt-fail);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailPreferences {
  private readonly api = inject(MailPreferencesApi);
  protected readonly resource = this.api.preferences();
  protected readonly rows = computed(() => {
    const list = this.resource.hasValue() ? this.resource.value() : [];
    return [...list].sort((a, b) => Number(b.appliesToYou) - Number(a.appliesToYou));
  });
  protected readonly saving = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected async toggle(p: MailPreferenceDto, change: MatSlideToggleChange): Promise<void> {
    this.saving.set(p.event);
    this.problem.set(null);
    try {
      this.resource.set(await this.api.save(p.event, change.checked));
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
      // The switch moved itself; the binding is unchanged (the stored value is), so it is put back by hand,
      // and the list is read again in case it changed meanwhile.
      change.source.checked = p.enabled;
      this.resource.reload();
    } finally {
      this.saving.set(null);
    }
  }
}
