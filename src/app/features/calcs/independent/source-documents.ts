import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { ATTACHMENT_KIND_LABELS } from '../../../../../shared/schemas/attachment.schema';
import { formatBytes } from '../../../../../shared/format';
import { LoadFailure } from '../../../ui/load-failure';
import { AttachmentsApi } from '../calc-page/attachments-api';

/**
 * The calc's attachments beside the independent model: the drawing, the duty specification and the
 * rest are what the checker builds from, so each opens in a new tab while the form stays put.
 */
@Component({
  selector: 'tt-source-documents',
  imports: [MatIconModule, LoadFailure],
  template: `
    <section class="docs" aria-labelledby="docs-h">
      <h2 id="docs-h">Source documents</h2>
      @if (list.error(); as error) {
        <tt-load-failure [error]="error" what="attachments of this revision" (retry)="list.reload()" />
      } @else if (list.hasValue()) {
        <ul>
          @for (a of list.value().items; track a.id) {
            <li>
              <mat-icon aria-hidden="true">{{ a.kind === 'drawing' ? 'architecture' : 'description' }}</mat-icon>
              <a [href]="'/api/attachments/' + a.id" target="_blank" rel="noopener"
                >{{ a.fileName }}<span class="tt-visually-hidden"> (opens in a new tab)</span></a
              >
              <span class="tt-muted">{{ kindLabel(a.kind) }} · {{ size(a.sizeBytes) }}</span>
            </li>
          } @empty {
            <li class="tt-muted">
              No attachments on this revision. Ask the author for the drawing and duty specification.
            </li>
          }
        </ul>
      } @else {
        <p class="tt-muted">Loading the attachments…</p>
      }
    </section>
  `,
  styles: `
    .docs {
      border: 1px solid var(--tt-rule);
      border-radius: 4px;
      padding: 4px 14px 8px;
      margin-bottom: 16px;
    }
    h2 {
      font: var(--mat-sys-title-small);
      margin: 8px 0 4px;
    }
    ul {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-wrap: wrap;
      gap: 6px 24px;
    }
    li {
      display: flex;
      align-items: center;
      gap: 6px;
      font-size: 13.5px;
      min-width: 0;
      overflow-wrap: anywhere;
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
      flex: none;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SourceDocuments {
  private readonly api = inject(AttachmentsApi);
  readonly revisionId = input.required<number>();
  protected readonly list = this.api.list(computed(() => this.revisionId()));
  protected readonly kindLabel = (k: keyof typeof ATTACHMENT_KIND_LABELS) => ATTACHMENT_KIND_LABELS[k];
  protected readonly size = formatBytes;
}
