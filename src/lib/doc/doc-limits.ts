/** Limits a stored page document must stay within; checked before any recursive code sees it. */
export const DOC_LIMITS = {
  /** UTF-8 bytes of the document's JSON. */
  maxBytes: 1024 * 1024,
  /** Nodes of any kind, text included. A 96-line input list with six columns is about 2,000. */
  maxNodes: 20_000,
  /** Nesting of nodes, the doc itself being level 1. Real pages rarely pass 12. */
  maxDepth: 40,
} as const;
