/**
 * What a stored file's id and address look like, for the routes that serve files, the checks on
 * saved documents and the read view alike. One definition, so an id one part accepts is never
 * refused (or, worse, read differently) by another.
 */

export const FILE_VARIANTS = ['original', 'display', 'thumb'] as const;
export type FileVariant = (typeof FILE_VARIANTS)[number];

const ID = '[A-Za-z0-9_-]{1,80}';
const FILE_ID = new RegExp(`^${ID}$`);
/** `/files/<id>`, then the end, a variant or a query or fragment. */
const FILE_PATH = new RegExp(`^/files/(${ID})(?=[/?#]|$)`);
const IMAGE_SRC = new RegExp(`^/files/${ID}(/(${FILE_VARIANTS.join('|')}))?$`);

export function isFileId(id: unknown): id is string {
  return typeof id === 'string' && FILE_ID.test(id);
}

/** The id inside a `/files/<id>[/variant][?…][#…]` address of this site; null for anything else. */
export function fileIdOfUrl(url: unknown): string | null {
  if (typeof url !== 'string') return null;
  return FILE_PATH.exec(url)?.[1] ?? null;
}

/** Images may only come from this instance's own file route, as the original or a variant. */
export function isOwnFileUrl(src: unknown): src is string {
  return typeof src === 'string' && IMAGE_SRC.test(src);
}
