import type { PmNode } from '~/lib/doc/types';
import { validateDoc } from '~/lib/doc/validate-doc';
import { HttpError } from './http';

/** The server's check of a page document (see validateDoc); a refusal is a 400 or 413 on `doc`. */
export function checkDocOrThrow(input: unknown): { doc: PmNode; plainText: string } {
  const result = validateDoc(input);
  if (!result.ok) throw new HttpError(result.status, result.message, 'doc');
  return { doc: result.doc, plainText: result.plainText };
}
