import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { idSchema, MAX_ATTACHMENT_BYTES } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { noSuchFinding } from '../review/findings.ts';
import { noSuchWorksheet } from '../worksheets/worksheets.ts';
import {
  downloadAttachment,
  getAttachments,
  noSuchAttachment,
  removeAttachment,
  uploadAttachment,
} from './attachments.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function idOr404(raw: unknown, notFound: () => Error): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw notFound();
  return parsed.data;
}

const optionalFindingId = (raw: unknown) =>
  raw === undefined || raw === '' ? undefined : idOr404(raw, noSuchFinding);

const upload = multer({
  storage: multer.memoryStorage(),
  // Browsers send a UTF-8 file name without saying so; latin1 (multer's default) garbles it.
  defParamCharset: 'utf8',
  limits: { fileSize: MAX_ATTACHMENT_BYTES, files: 1, fields: 4, parts: 5, fieldSize: 1024 },
}).single('file');

function fromMulter(err: unknown): unknown {
  if (!(err instanceof multer.MulterError)) {
    // busboy's complaints about the body itself (bad boundary, truncated part…).
    return err instanceof Error && !(err instanceof AppError)
      ? new AppError('bad-request', `The upload is not valid multipart/form-data: ${err.message}`)
      : err;
  }
  if (err.code === 'LIMIT_FILE_SIZE') {
    return new AppError(
      'payload-too-large',
      `The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB, the most an attachment may be; nothing was stored.`,
    );
  }
  if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
    return new AppError('bad-request', 'Send exactly one file, in the field named "file".');
  }
  return new AppError('bad-request', `The upload was refused: ${err.message}.`);
}

/** multer with its errors turned into AppErrors (413 for a file over the limit). */
const parseUpload: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => next(err ? fromMulter(err) : undefined));
};

/** RFC 6266 / 5987: an ASCII fallback and the exact UTF-8 name, neither able to break the header. */
export function contentDisposition(filename: string): string {
  const fallback = filename.replace(/[^\x20-\x7e]|["\\%]/g, '_');
  const encoded = encodeURIComponent(filename).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );
  return `attachment; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}

/** `/api/orgs/:orgId/worksheets/:id/attachments`: upload and list. */
export function worksheetAttachmentRoutes(): Router {
  const router = Router({ mergeParams: true });
  const worksheetId = (params: Record<string, unknown>) => idOr404(params.id, noSuchWorksheet);
  router.post(
    '/:id/attachments',
    authorize('create', 'Attachment'),
    parseUpload,
    async (req, res) => {
      const id = worksheetId(req.params);
      const fields = (req.body ?? {}) as Record<string, unknown>;
      const file = req.file && { originalName: req.file.originalname, content: req.file.buffer };
      const findingId = optionalFindingId(fields.findingId);
      res.status(201).json(await uploadAttachment(orgContextOf(res), id, { file, findingId }));
    },
  );
  router.get('/:id/attachments', authorize('read', 'Attachment'), async (req, res) => {
    const id = worksheetId(req.params);
    const findingId = optionalFindingId(req.query.findingId);
    res.json(await getAttachments(orgContextOf(res), id, findingId));
  });
  return router;
}

/** `/api/orgs/:orgId/attachments/:attachmentId`: download and delete. */
export function attachmentRoutes(): Router {
  const router = Router({ mergeParams: true });
  const attachmentId = (params: Record<string, unknown>) =>
    idOr404(params.attachmentId, noSuchAttachment);
  router.get('/:attachmentId', authorize('read', 'Attachment'), async (req, res) => {
    const { attachment, content } = await downloadAttachment(
      orgContextOf(res),
      attachmentId(req.params),
    );
    res
      .status(200)
      .set({
        'Content-Type': attachment.contentType,
        'Content-Disposition': contentDisposition(attachment.filename),
        'X-Content-Type-Options': 'nosniff',
        'Cache-Control': 'private, no-store',
      })
      .send(content);
  });
  router.delete('/:attachmentId', authorize('delete', 'Attachment'), async (req, res) => {
    await removeAttachment(orgContextOf(res), attachmentId(req.params));
    res.status(204).end();
  });
  return router;
}
