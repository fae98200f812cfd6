import { Node as PmModelNode, type Schema } from '@tiptap/pm/model';
import { MARK_ATTR_RULES, NODE_ATTR_RULES, NODE_WHOLE_RULES, SCALAR_ATTR_RULE, showValue, type AttrRule } from './attr-rules';
import { DOC_LIMITS } from './doc-limits';
import { getDocSchema } from './doc-schema';
import { docPlainText } from './render-html';
import type { PmNode } from './types';

export type DocCheck =
  | { ok: true; doc: PmNode; plainText: string }
  | { ok: false; status: 400 | 413; message: string };

const NODE_KEYS = new Set(['type', 'attrs', 'content', 'text', 'marks']);
const MARK_KEYS = new Set(['type', 'attrs']);

class Refusal extends Error {
  constructor(
    message: string,
    readonly status: 400 | 413 = 400,
  ) {
    super(message);
  }
}

/**
 * The server's check of a page document, in an order that keeps hostile input cheap:
 * 1. an iterative walk (no recursion) enforcing the depth and node-count caps, the allowed keys,
 *    node and mark names and every attribute value;
 * 2. the size of the JSON;
 * 3. only then ProseMirror's own parse and content check against the shared schema.
 * The stored form is ProseMirror's normalised JSON, so defaults are filled in and nothing else.
 */
export function validateDoc(input: unknown, schema: Schema = getDocSchema()): DocCheck {
  try {
    walk(input, schema);
    const bytes = new TextEncoder().encode(JSON.stringify(input)).length;
    if (bytes > DOC_LIMITS.maxBytes) {
      throw new Refusal(`The page is ${(bytes / 1024 / 1024).toFixed(1)} MiB; the limit is 1 MiB. Split it into several pages.`, 413);
    }
    const withBody = ensureBody(input as PmNode);
    let parsed: PmModelNode;
    try {
      parsed = PmModelNode.fromJSON(schema, withBody);
      parsed.check();
    } catch (err) {
      throw new Refusal(`The page's structure is not valid (${err instanceof Error ? err.message : 'unreadable'}). Reload the editor and save again.`);
    }
    const doc = parsed.toJSON() as PmNode;
    return { ok: true, doc, plainText: searchableText(doc) };
  } catch (err) {
    if (err instanceof Refusal) return { ok: false, status: err.status, message: err.message };
    throw err;
  }
}

/** Plain text for search and the diff; control characters removed so they can serve as markers. */
export function searchableText(doc: PmNode): string {
  return docPlainText(doc).replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, '');
}

/** An empty document is saved as one empty paragraph, as the editor itself would. */
function ensureBody(doc: PmNode): PmNode {
  return doc.content && doc.content.length > 0 ? doc : { ...doc, content: [{ type: 'paragraph' }] };
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function walk(root: unknown, schema: Schema): void {
  if (!isPlainObject(root) || root.type !== 'doc') {
    throw new Refusal('The document must be an object with "type": "doc", as the editor sends it.');
  }
  const stack: { node: unknown; depth: number }[] = [{ node: root, depth: 1 }];
  let count = 0;
  while (stack.length) {
    const { node, depth } = stack.pop()!;
    if (++count > DOC_LIMITS.maxNodes) {
      throw new Refusal(`The page has more than ${DOC_LIMITS.maxNodes.toLocaleString('en')} parts; split it into several pages.`, 413);
    }
    if (depth > DOC_LIMITS.maxDepth) {
      throw new Refusal(`The page is nested more than ${DOC_LIMITS.maxDepth} levels deep; flatten the lists or tables.`);
    }
    checkNode(node, schema);
    const content = (node as PmNode).content;
    if (content && count + stack.length + content.length > DOC_LIMITS.maxNodes) {
      throw new Refusal(`The page has more than ${DOC_LIMITS.maxNodes.toLocaleString('en')} parts; split it into several pages.`, 413);
    }
    if (content) for (let i = content.length - 1; i >= 0; i--) stack.push({ node: content[i], depth: depth + 1 });
  }
}

function checkNode(node: unknown, schema: Schema): void {
  if (!isPlainObject(node) || typeof node.type !== 'string') {
    throw new Refusal('Every part of the page must be an object with a "type".');
  }
  const type = node.type;
  const nodeType = schema.nodes[type];
  if (!nodeType) throw new Refusal(`The page contains a block of type ${showValue(type)} that Throwline does not know. Remove it and save again.`);
  for (const key of Object.keys(node)) {
    if (!NODE_KEYS.has(key)) throw new Refusal(`A ${type} part has an unexpected field ${showValue(key)}.`);
  }
  if (node.content !== undefined && !Array.isArray(node.content)) throw new Refusal(`The content of a ${type} part must be a list.`);
  if (type === 'text') {
    if (typeof node.text !== 'string' || node.text.length === 0) throw new Refusal('Text parts need a non-empty "text".');
  } else if (node.text !== undefined) {
    throw new Refusal(`Only text parts carry "text", not a ${type} part.`);
  }
  const whole = NODE_WHOLE_RULES[type];
  if (whole) checkWholeAttrs(node.attrs, type, nodeType.spec.attrs ?? {}, whole);
  else checkAttrs(node.attrs, type, Object.keys(nodeType.spec.attrs ?? {}), NODE_ATTR_RULES[type], 'block');
  if (node.marks !== undefined) {
    if (!Array.isArray(node.marks) || node.marks.length > 10) throw new Refusal('Text styles (marks) must be a short list.');
    for (const mark of node.marks) checkMark(mark, schema);
  }
}

function checkMark(mark: unknown, schema: Schema): void {
  if (!isPlainObject(mark) || typeof mark.type !== 'string') throw new Refusal('Every text style (mark) must be an object with a "type".');
  const markType = schema.marks[mark.type];
  if (!markType) throw new Refusal(`The page uses a text style ${showValue(mark.type)} that Throwline does not know. Remove it and save again.`);
  for (const key of Object.keys(mark)) {
    if (!MARK_KEYS.has(key)) throw new Refusal(`A ${mark.type} style has an unexpected field ${showValue(key)}.`);
  }
  checkAttrs(mark.attrs, mark.type, Object.keys(markType.spec.attrs ?? {}), MARK_ATTR_RULES[mark.type], 'style');
}

function checkAttrs(attrs: unknown, type: string, known: string[], rules: Record<string, AttrRule> | undefined, kind: 'block' | 'style'): void {
  if (attrs !== undefined && attrs !== null && !isPlainObject(attrs)) throw new Refusal(`The attributes of a ${type} ${kind} must be an object.`);
  const given = (attrs ?? {}) as Record<string, unknown>;
  for (const [name, value] of Object.entries(given)) {
    if (!known.includes(name)) throw new Refusal(`The ${type} ${kind} has no attribute ${showValue(name)}; remove it.`);
    const rule = rules?.[name] ?? SCALAR_ATTR_RULE;
    if (!rule.check(value)) throw new Refusal(rule.explain(showValue(value)));
  }
  for (const [name, rule] of Object.entries(rules ?? {})) {
    if (rule.required && !(name in given)) throw new Refusal(rule.explain('a missing value'));
  }
}

function checkWholeAttrs(attrs: unknown, type: string, specs: Record<string, { default?: unknown }>, rule: (attrs: Record<string, unknown>) => string | null): void {
  if (attrs !== undefined && attrs !== null && !isPlainObject(attrs)) throw new Refusal(`The attributes of a ${type} block must be an object.`);
  const given = (attrs ?? {}) as Record<string, unknown>;
  for (const name of Object.keys(given)) {
    if (!(name in specs)) throw new Refusal(`The ${type} block has no attribute ${showValue(name)}; remove it.`);
  }
  const merged = Object.fromEntries(Object.entries(specs).map(([name, spec]) => [name, name in given ? given[name] : spec.default]));
  const problem = rule(merged);
  if (problem) throw new Refusal(problem);
}
