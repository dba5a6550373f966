import { createHash } from 'node:crypto';
import {
  editableWorksheetStates,
  subject,
  type Attachment,
  type WorksheetState,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import { noSuchFinding } from '../review/findings.ts';
import { lockWorksheet } from '../worksheets/guards.ts';
import { findCurrentRevisionForUpdate, findWorksheet } from '../worksheets/repository.ts';
import { noSuchWorksheet } from '../worksheets/worksheets.ts';
import {
  deleteAttachment,
  findingWorksheetId,
  insertAttachment,
  listAttachments,
  readAttachment,
  readAttachmentContent,
} from './repository.ts';
import { allowedTypesText, sanitizeFilename, sniffAttachmentType } from './sniff.ts';

export const noSuchAttachment = () =>
  new AppError('not-found', 'No such attachment in this organization');

/** Until sign-off the review may still gather evidence; a signed or withdrawn record is closed. */
const uploadStates: readonly WorksheetState[] = ['draft', 'in_check', 'checked', 'returned'];

const stateWords = (state: WorksheetState) => state.replace('_', ' ');

export interface UploadInput {
  /** Absent when the request carried no `file` part. */
  file?: { originalName: string; content: Buffer };
  findingId?: string;
}

async function assertFindingOf(tx: OrgTx, worksheetId: string, findingId: string): Promise<void> {
  if ((await findingWorksheetId(tx, findingId)) !== worksheetId) throw noSuchFinding();
}

/** Type and hash from the bytes, worked out before the organization's write lock is taken. */
function examine(file: UploadInput['file']) {
  if (!file) return null;
  return {
    sniffed: file.content.length > 0 ? sniffAttachmentType(file.content) : null,
    sha256: createHash('sha256').update(file.content).digest('hex'),
  };
}

/**
 * Stores a file on a worksheet (or one of its findings) against the current revision. Checks
 * in order: 404 worksheet or finding, 403 who, 400 no file or empty, 415 type, 409 state.
 */
export async function uploadAttachment(
  org: OrgContext,
  worksheetId: string,
  input: UploadInput,
): Promise<Attachment> {
  const examined = examine(input.file);
  return org.write(async (tx) => {
    const worksheet = await lockWorksheet(tx, worksheetId);
    if (input.findingId) await assertFindingOf(tx, worksheetId, input.findingId);
    const asSubject = subject('Attachment', { worksheetAuthorId: worksheet.authorUserId });
    if (!org.ability.can('create', asSubject)) {
      throw new AppError(
        'forbidden',
        'Only the author of this worksheet, a checker or an approver may attach files to it.',
      );
    }
    if (!input.file || !examined) {
      throw new AppError(
        'bad-request',
        'Send the file as multipart/form-data in a field named "file".',
      );
    }
    if (input.file.content.length === 0) throw new AppError('bad-request', 'The file is empty.');
    if (!examined.sniffed) {
      throw new AppError(
        'unsupported-media-type',
        `This file is not a ${allowedTypesText} (judged by its content, not its name); ` +
          'only those can be attached.',
      );
    }
    if (!uploadStates.includes(worksheet.state)) {
      throw new AppError(
        'conflict',
        `This worksheet is ${stateWords(worksheet.state)}; its record no longer takes attachments.`,
      );
    }
    const filename = sanitizeFilename(
      input.file.originalName,
      `attachment.${examined.sniffed.type}`,
    );
    const record = {
      worksheetId,
      findingId: input.findingId ?? null,
      revision: worksheet.currentRevision,
      filename,
      type: examined.sniffed.type,
      size: input.file.content.length,
      sha256: examined.sha256,
    };
    const id = await insertAttachment(tx, {
      ...record,
      contentType: examined.sniffed.contentType,
      content: input.file.content,
      userId: org.actor.userId,
    });
    await tx.audit({
      action: 'attachment.uploaded',
      targetType: 'attachment',
      targetId: id,
      details: record,
    });
    return (await readAttachment(tx, id))!;
  });
}

export async function getAttachments(
  org: OrgContext,
  worksheetId: string,
  findingId?: string,
): Promise<{ items: Attachment[]; total: number }> {
  return org.read(async (tx) => {
    if (!(await findWorksheet(tx, worksheetId))) throw noSuchWorksheet();
    if (findingId) await assertFindingOf(tx, worksheetId, findingId);
    const items = await listAttachments(tx, worksheetId, findingId);
    return { items, total: items.length };
  });
}

const auditDetails = (a: Attachment) => ({
  worksheetId: a.worksheetId,
  findingId: a.findingId,
  revision: a.revision,
  filename: a.filename,
  type: a.type,
  size: a.size,
  sha256: a.sha256,
});

/** The bytes; who read a record is worth knowing, so each download is audited. */
export async function downloadAttachment(
  org: OrgContext,
  id: string,
): Promise<{ attachment: Attachment; content: Buffer }> {
  return org.write(async (tx) => {
    const attachment = await readAttachment(tx, id);
    const content = attachment ? await readAttachmentContent(tx, id) : null;
    if (!attachment || !content) throw noSuchAttachment();
    await tx.audit({
      action: 'attachment.downloaded',
      targetType: 'attachment',
      targetId: id,
      details: auditDetails(attachment),
    });
    return { attachment, content };
  });
}

/**
 * Its uploader removes an attachment while the worksheet is editable and the attachment belongs
 * to the current, unfrozen revision; a frozen revision's attachments are part of the record.
 */
export async function removeAttachment(org: OrgContext, id: string): Promise<void> {
  await org.write(async (tx) => {
    const attachment = await readAttachment(tx, id, { lock: true });
    if (!attachment) throw noSuchAttachment();
    const worksheet = await lockWorksheet(tx, attachment.worksheetId);
    const asSubject = subject('Attachment', {
      worksheetAuthorId: worksheet.authorUserId,
      uploadedById: attachment.uploadedBy.id,
    });
    if (!org.ability.can('delete', asSubject)) {
      throw new AppError(
        'forbidden',
        'Only the person who uploaded this attachment may delete it.',
      );
    }
    if (!editableWorksheetStates.includes(worksheet.state)) {
      throw new AppError(
        'conflict',
        `This worksheet is ${stateWords(worksheet.state)}; attachments can be deleted only ` +
          'while it is a draft or returned.',
      );
    }
    const current = await findCurrentRevisionForUpdate(tx, worksheet);
    if (attachment.revision !== worksheet.currentRevision || !current || current.frozen) {
      throw new AppError(
        'conflict',
        `This attachment belongs to revision ${attachment.revision}, which is frozen: it is ` +
          'part of the record and cannot be deleted.',
      );
    }
    await deleteAttachment(tx, id);
    await tx.audit({
      action: 'attachment.deleted',
      targetType: 'attachment',
      targetId: id,
      details: auditDetails(attachment),
    });
  });
}
