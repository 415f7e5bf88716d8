import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { AbilityServiceSignal } from '@casl/angular';
import type { AppAbility } from '../../../../../shared/authz/app-ability';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';

/** The record leaving the app: the calc report of this revision, compliance's evidence pack, and verification. */
@Component({
  selector: 'tt-record-exports',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  template: `
    <a mat-stroked-button [href]="reportUrl()" download><mat-icon>picture_as_pdf</mat-icon> Calc report (PDF)</a>
    @if (canExportPack()) {
      <a mat-stroked-button [href]="packUrl()" download><mat-icon>inventory_2</mat-icon> Evidence pack</a>
    }
    @if (revision().contentHash; as hash) {
      <a mat-button [routerLink]="['/verify', hash]"><mat-icon>verified</mat-icon> Verify record</a>
    }
  `,
  styles: `
    :host {
      display: contents;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordExports {
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);
  readonly revision = input.required<RevisionDto>();
  protected readonly reportUrl = computed(() => `/api/revisions/${this.revision().id}/report.pdf`);
  protected readonly packUrl = computed(() => `/api/calcs/${this.revision().calcId}/evidence.zip`);
  protected readonly canExportPack = computed(() => this.ability.can('audit', 'Calc'));
}
