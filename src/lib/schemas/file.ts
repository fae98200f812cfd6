import { z } from 'zod';
import { MAX_CAPTION_CHARS } from '~/lib/upload-limits';
import { displayText } from './display-text';

export { MAX_CAPTION_CHARS, MAX_UPLOAD_BYTES, UPLOAD_ACCEPT } from '~/lib/upload-limits';

const caption = displayText('the caption', { max: MAX_CAPTION_CHARS });

/** The text fields that travel beside the file in a multipart upload. */
export const FileUploadFieldsSchema = z.object({
  caption: caption.default(''),
  /** Slug of a page of the same venue the file belongs to; empty means none. */
  page: z
    .string({ error: 'The page must be given by its slug.' })
    .trim()
    .max(100, 'There is no page with such a long slug.')
    .optional()
    .transform((v) => (v ? v : undefined)),
});
export type FileUploadFields = z.infer<typeof FileUploadFieldsSchema>;

export const FileCaptionSchema = z.object({ caption }).strict();
export type FileCaption = z.infer<typeof FileCaptionSchema>;

export { FILE_VARIANTS, type FileVariant } from '~/lib/file-url';

export interface PageRef {
  slug: string;
  title: string;
}

/** A file as the API and the files screen see it. */
export interface FileView {
  id: string;
  /** `trace`: a measured response uploaded as plain-text columns (see src/lib/traces). */
  kind: 'image' | 'pdf' | 'trace';
  mime: string;
  /** The uploader's file name, cleaned; display text only. */
  originalName: string;
  caption: string;
  sizeBytes: number;
  width: number | null;
  height: number | null;
  /** `/files/<id>`: the stored original (for photos: re-encoded, orientation applied, no metadata). */
  url: string;
  /** `/files/<id>/display`: WebP, at most 1600 px on the long edge. Null for PDFs. */
  displayUrl: string | null;
  /** `/files/<id>/thumb`: WebP, at most 400 px on the long edge. Null for PDFs. */
  thumbUrl: string | null;
  /** The page the file was uploaded for, if any. */
  page: PageRef | null;
  /** Pages whose current revision shows or links to this file. */
  usedBy: PageRef[];
  uploadedBy: string | null;
  createdAt: string;
  /** True when the start-up check found the row's bytes gone from disk. */
  missing: boolean;
}
