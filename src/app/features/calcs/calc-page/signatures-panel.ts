import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { DatePipe, SlicePipe } from '@angular/common';
import { MatIconModule } from '@angular/material/icon';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { EmptyState } from '../../../ui/empty-state';

/** Signatures with their validity against the revision's content as stored now, and the attachments each covered. */
@Component({
  selector: 'tt-signatures-panel',
  imports: [DatePipe, SlicePipe, MatIconModule, EmptyState],
  template: `
    <p class="hash">
      Content hash now: <span class="tt-mono">{{ revision().contentHash ?? 'none (input has errors)' }}</span>
    </p>
    <ul class="sigs">
      @for (s of revision().signatures; track s.id) {
        <li [class.invalid]="!s.isValid">
          <mat-icon aria-hidden="true">{{ s.isValid ? 'verified' : 'gpp_bad' }}</mat-icon>
          <div>
            <div>
              <strong>{{ s.printedName }}</strong> — {{ s.meaning }} ({{ s.role }})
            </div>
            <div class="tt-muted small tt-mono">
              {{ s.signedAt | date: 'y-MM-dd HH:mm:ss' : 'UTC' }} UTC · hash {{ s.contentHash | slice: 0 : 16 }}…
            </div>
            <div class="validity">
              {{
                s.isValid
                  ? 'Matches the content as stored now.'
                  : 'No longer matches: the content or the attachments changed after this signature.'
              }}
            </div>
            <div class="covered tt-muted small">
              @if (s.attachments === null) {
                Made before attachments were part of what is signed: covers none.
              } @else if (s.attachments.length === 0) {
                Covered no attachments.
              } @else {
                Covered {{ s.attachments.length }} attachment{{ s.attachments.length === 1 ? '' : 's' }}:
                @for (a of s.attachments; track a.sha256 + a.name) {
                  <span class="att"
                    >{{ a.name }} ({{ a.kind }}, <span class="tt-mono">{{ a.sha256 | slice: 0 : 12 }}…</span>)</span
                  >
                }
              }
            </div>
          </div>
        </li>
      } @empty {
        <tt-empty-state icon="draw" title="Not signed yet"
          >Signatures appear when the author submits, the checker checks and the approver approves.</tt-empty-state
        >
      }
    </ul>
  `,
  styles: `
    .hash {
      font-size: 12px;
      word-break: break-all;
      margin: 0 0 10px;
    }
    .sigs {
      list-style: none;
      padding: 0;
      margin: 0;
      display: grid;
      gap: 10px;
    }
    li {
      display: flex;
      gap: 12px;
      padding: 10px 14px;
      border: 1px solid var(--tt-rule);
      border-radius: 4px;
      background: #fffdf8;
    }
    li mat-icon {
      color: var(--tt-pass);
    }
    li.invalid {
      border-color: var(--tt-fail);
      background: #fbefed;
      mat-icon {
        color: var(--tt-fail);
      }
    }
    .small {
      font-size: 12px;
    }
    .validity {
      font-size: 12px;
      margin-top: 2px;
    }
    .covered {
      margin-top: 4px;
    }
    .att:not(:last-child)::after {
      content: '; ';
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignaturesPanel {
  readonly revision = input.required<RevisionDto>();
}
