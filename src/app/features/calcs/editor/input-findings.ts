import { Directive, ElementRef, Renderer2, afterEveryRender, inject, input } from '@angular/core';
import type { FindingDto } from '../../../../../shared/schemas/calc-dto';

interface Placed {
  note: HTMLElement;
  field: Element;
  text: string;
}

/*
 * Findings anchored to a named input (`segments[1].od`, or a whole entry such as `segments[1]` or `material`) shown
 * beside that field in the editor, as the checklist shows clause-anchored ones on their rows. The panels already
 * mark each field with its input path (`data-path`), so the notes are placed by path after each render and no panel
 * needs to know about findings.
 */
@Directive({ selector: '[ttInputFindings]' })
export class InputFindings {
  readonly findings = input.required<readonly FindingDto[]>({ alias: 'ttInputFindings' });
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly renderer = inject(Renderer2);
  private readonly placed = new Map<number, Placed>();

  constructor() {
    afterEveryRender({ write: () => this.place() });
  }

  private place(): void {
    const wanted = new Map<number, { finding: FindingDto; field: Element }>();
    for (const f of this.findings()) {
      const field = f.anchorPath && !f.clauseRef ? this.fieldOf(f.anchorPath) : null;
      if (field) wanted.set(f.id, { finding: f, field });
    }
    for (const [id, p] of this.placed) {
      const w = wanted.get(id);
      if (w && w.field === p.field && p.note.isConnected && p.text === noteText(w.finding)) continue;
      p.note.remove();
      this.placed.delete(id);
    }
    for (const [id, { finding, field }] of wanted)
      if (!this.placed.has(id)) this.placed.set(id, this.note(finding, field));
  }

  /** The field the path names, or for an entry or group the first field inside it; beside its form field. */
  private fieldOf(path: string): Element | null {
    const root = this.host.nativeElement;
    const quoted = JSON.stringify(path);
    const input =
      root.querySelector(`[data-path=${quoted}]`) ??
      root.querySelector(`[data-path^=${JSON.stringify(`${path}.`)}]`) ??
      root.querySelector(`[data-path^=${JSON.stringify(`${path}[`)}]`);
    return input?.closest('mat-form-field') ?? input;
  }

  private note(finding: FindingDto, field: Element): Placed {
    const note = this.renderer.createElement('p') as HTMLElement;
    const text = noteText(finding);
    this.renderer.addClass(note, 'tt-finding-note');
    this.renderer.addClass(note, 'tt-input-finding');
    this.renderer.setAttribute(note, 'data-status', finding.status);
    this.renderer.setAttribute(note, 'data-finding', String(finding.id));
    this.renderer.setAttribute(note, 'role', 'note');
    this.renderer.appendChild(note, this.renderer.createText(text));
    field.after(note);
    return { note, field, text };
  }
}

function noteText(f: FindingDto): string {
  return `F${f.id} ${f.status}: ${f.text}${f.answer ? ` — answer: ${f.answer}` : ''}`;
}
