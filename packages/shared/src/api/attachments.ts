import { z } from 'zod';
import { personRefSchema } from './worksheets.ts';

/** Largest attachment, bytes. */
export const MAX_ATTACHMENT_BYTES = 20 * 1024 * 1024;

/**
 * What an attachment may be, decided from its content (never its name or the browser's type):
 * PDF (`%PDF-`), PNG (its 8-byte signature), JPEG (`FF D8 FF`), and text: CSV or a SPICE deck
 * (UTF-8 without NUL bytes, not starting with `<`; a deck when the engine's parser reads an
 * element from it or a line starts with `.end`/`.op`, else CSV when its delimiters are consistent).
 */
export const attachmentTypes = ['pdf', 'png', 'jpeg', 'csv', 'deck'] as const;
export type AttachmentType = (typeof attachmentTypes)[number];

/**
 * `POST /api/orgs/:orgId/worksheets/:id/attachments` (multipart: `file`, optional `findingId`)
 * → 201; `GET …/worksheets/:id/attachments` → list; `GET /api/orgs/:orgId/attachments/:attachmentId`
 * → the bytes with `Content-Disposition: attachment`; `DELETE …/attachments/:attachmentId`.
 */
export const attachmentSchema = z.object({
  id: z.string(),
  worksheetId: z.string(),
  /** The finding it belongs to, or null for the worksheet itself. */
  findingId: z.string().nullable(),
  /** The revision current when it was uploaded. */
  revision: z.string(),
  filename: z.string(),
  type: z.enum(attachmentTypes),
  /** The Content-Type it is served with. */
  contentType: z.string(),
  size: z.number().int().min(0),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  uploadedBy: personRefSchema,
  uploadedAt: z.string(),
});
export type Attachment = z.infer<typeof attachmentSchema>;
export const attachmentListSchema = z.object({
  items: z.array(attachmentSchema),
  total: z.number(),
});
