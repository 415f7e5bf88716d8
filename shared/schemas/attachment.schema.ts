import { z } from 'zod';

/** What an attachment is for; a checklist manual item can require one of a given kind. */
export const ATTACHMENT_KINDS = ['drawing', 'material-certificate', 'other'] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

export const ATTACHMENT_KIND_LABELS: Record<AttachmentKind, string> = {
  drawing: 'Drawing',
  'material-certificate': 'Material certificate',
  other: 'Supporting file',
};

/** The text fields sent with an upload (multipart form fields beside `file`). */
export const uploadFieldsSchema = z
  .object({
    kind: z.enum(ATTACHMENT_KINDS, { error: `must be one of ${ATTACHMENT_KINDS.join(', ')}` }),
    note: z.string().trim().max(500, 'is at most 500 characters').default(''),
  })
  .strict();
export type UploadFields = z.infer<typeof uploadFieldsSchema>;

export interface AttachmentDto {
  id: number;
  revisionId: number;
  kind: AttachmentKind;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  note: string;
  uploadedBy: { id: number; name: string };
  createdAt: string;
}

export interface AttachmentListDto {
  items: AttachmentDto[];
  /** False once the revision is approved, superseded or withdrawn: its files are then read-only. */
  canAdd: boolean;
  maxBytes: number;
  acceptedTypes: string[];
}
