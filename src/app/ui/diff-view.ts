import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

interface Row {
  left: string | null;
  right: string | null;
  kind: 'same' | 'changed' | 'hunk';
}

/**
 * A unified diff (as stored with each audit entry) laid out side by side: removed lines on the
 * left, added lines on the right, context on both, so an auditor reads old and new together.
 */
export function sideBySide(unified: string): Row[] {
  const rows: Row[] = [];
  let removed: string[] = [];
  let added: string[] = [];
  const flush = () => {
    for (let i = 0; i < Math.max(removed.length, added.length); i++)
      rows.push({ left: removed[i] ?? null, right: added[i] ?? null, kind: 'changed' });
    removed = [];
    added = [];
  };
  for (const line of unified.split('\n')) {
    if (
      line.startsWith('===') ||
      line.startsWith('---') ||
      line.startsWith('+++') ||
      line === '\\ No newline at end of file'
    )
      continue;
    if (line.startsWith('@@')) {
      flush();
      rows.push({ left: line, right: line, kind: 'hunk' });
      continue;
    }
    if (line.startsWith('-')) {
      removed.push(line.slice(1));
      continue;
    }
    if (line.startsWith('+')) {
      added.push(line.slice(1));
      continue;
    }
    flush();
    if (line.length) rows.push({ left: line.slice(1), right: line.slice(1), kind: 'same' });
  }
  flush();
  return rows;
}

@Component({
  selector: 'tt-diff-view',
  template: `
    <table class="diff" aria-label="Before and after">
      <thead>
        <tr>
          <th>Before</th>
          <th>After</th>
        </tr>
      </thead>
      <tbody>
        @for (r of rows(); track $index) {
          <tr [attr.data-kind]="r.kind">
            <td [class.del]="r.kind === 'changed' && r.left !== null">
              <pre>{{ r.left ?? '' }}</pre>
            </td>
            <td [class.add]="r.kind === 'changed' && r.right !== null">
              <pre>{{ r.right ?? '' }}</pre>
            </td>
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    .diff {
      width: 100%;
      border-collapse: collapse;
      table-layout: fixed;
      font-size: 12px;
    }
    th {
      text-align: left;
      font-weight: 500;
      color: var(--tt-ink-soft);
      padding: 4px 8px;
    }
    td {
      vertical-align: top;
      padding: 0 8px;
      border-left: 1px solid var(--tt-rule);
    }
    pre {
      margin: 0;
      font-family: var(--tt-mono);
      white-space: pre-wrap;
      word-break: break-all;
    }
    .del {
      background: #f8e0dc;
    }
    .add {
      background: #dff0e6;
    }
    tr[data-kind='hunk'] td {
      color: var(--tt-ink-soft);
      background: #efe9dd;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiffView {
  readonly diff = input.required<string>();
  protected readonly rows = computed(() => sideBySide(this.diff()));
}
