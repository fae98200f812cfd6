import { getSchema } from '@tiptap/core';
import type { Schema } from '@tiptap/pm/model';
import { docExtensions } from './extensions';

let cached: Schema | undefined;

/** The ProseMirror schema of a page, built once from the shared extension list. */
export function getDocSchema(): Schema {
  cached ??= getSchema(docExtensions);
  return cached;
}
