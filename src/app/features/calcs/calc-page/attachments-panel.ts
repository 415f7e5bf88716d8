import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { DatePipe, DecimalPipe } from '@angular/common';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatIconModule } from '@angular/material/icon';
import {
  ATTACHMENT_KINDS,
  ATTACHMENT_KIND_LABELS,
  type AttachmentDto,
  type AttachmentKind,
} from '../../../../../shared/schemas/attachment.schema';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { SessionStore } from '../../../core/auth/session-store';
import { assertApiFailure } from '../../../core/http/api-failure';
import { LoadFailure } from '../../../ui/load-failure';
import { formatBytes } from '../../../../../shared/format';
import { EmptyState } from '../../../ui/empty-state';
import { AttachmentsApi } from './attachments-api';
import { EDITABLE_STATES } from '../../../../../shared/workflow/state-sets';

/** Drawings, certificates and supporting files of the selected revision, and the form to add one. */
@Component({
  selector: 'tt-attachments-panel',
  imports: [
    DatePipe,
    DecimalPipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatIconModule,
    EmptyState,
    LoadFailure,
  ],
  templateUrl: './attachments-panel.html',
  styleUrl: './attachments-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AttachmentsPanel {
  private readonly api = inject(AttachmentsApi);
  private readonly me = inject(SessionStore).user;
  readonly revision = input.required<RevisionDto>();
  /** The attachment set is part of the signed content: the page reloads the revision (hash, signatures). */
  readonly changed = output<void>();
  protected readonly list = this.api.list(computed(() => this.revision().id));
  protected readonly kinds = ATTACHMENT_KINDS.map((k) => ({ value: k, label: ATTACHMENT_KIND_LABELS[k] }));
  protected readonly labels = ATTACHMENT_KIND_LABELS;
  protected readonly form = inject(NonNullableFormBuilder).group({ kind: ['drawing' as AttachmentKind], note: [''] });
  protected readonly file = signal<File | null>(null);
  private readonly fileInput = viewChild<ElementRef<HTMLInputElement>>('fileInput');
  protected readonly problem = signal<string | null>(null);
  protected readonly isUploading = signal(false);
  protected readonly isEditable = computed(() => EDITABLE_STATES.includes(this.revision().status));
  protected readonly maxMb = computed(() => (this.list.hasValue() ? this.list.value().maxBytes / 1024 / 1024 : null));
  /** Kinds the standard's manual items ask for that the revision does not have yet. */
  protected readonly missing = computed(() => {
    const manual =
      (this.revision().checklist as { manual?: { requiresAttachment: AttachmentKind | null }[] } | null)?.manual ?? [];
    const have = new Set((this.list.hasValue() ? this.list.value().items : []).map((a) => a.kind));
    return [
      ...new Set(manual.map((m) => m.requiresAttachment).filter((k): k is AttachmentKind => !!k && !have.has(k))),
    ];
  });

  protected readonly missingText = computed(() =>
    this.missing()
      .map((k) => ATTACHMENT_KIND_LABELS[k].toLowerCase())
      .join(', '),
  );

  protected canRemove(a: AttachmentDto): boolean {
    const me = this.me()?.id;
    return this.isEditable() && (a.uploadedBy.id === me || this.revision().author?.id === me);
  }

  protected readonly size = formatBytes;

  protected pick(files: FileList | null): void {
    this.file.set(files?.item(0) ?? null);
  }

  protected async uploadFile(): Promise<void> {
    const file = this.file();
    if (!file) return this.problem.set('Choose a file first');
    this.isUploading.set(true);
    this.problem.set(null);
    try {
      const { kind, note } = this.form.getRawValue();
      await this.api.upload(this.revision().id, file, kind, note);
      this.file.set(null);
      // The browser keeps the chosen name in the native input until it is cleared.
      const el = this.fileInput()?.nativeElement;
      if (el) el.value = '';
      this.form.controls.note.reset();
      this.list.reload();
      this.changed.emit();
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.fieldErrors['file']?.[0] ? `The file ${error.fieldErrors['file'][0]}` : error.message);
    } finally {
      this.isUploading.set(false);
    }
  }

  protected async remove(a: AttachmentDto): Promise<void> {
    try {
      await this.api.remove(a.id);
      this.list.reload();
      this.changed.emit();
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
    }
  }
}
