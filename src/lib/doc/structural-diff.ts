/**
 * What changed between two revisions, structurally: processor blocks in words, tables cell by cell
 * with row and column named, photos added or removed, links whose target changed, checklist ticks.
 * The word diff covers the running text; this covers everything the words alone cannot show. When
 * two documents differ and nothing here names it, the last change says so (formatting), so history
 * never claims that different revisions are the same.
 */
import { blockChanges } from './blocks/block-diff';
import { PROCESSOR_BLOCKS } from './blocks/block-data';
import type { PmNode } from './types';

export type ChangeKind = 'block' | 'table' | 'photo' | 'link' | 'check' | 'format';

export interface DocChange {
  kind: ChangeKind;
  /** One line, e.g. 'EQ "Mains": 2 changes'. */
  title: string;
  /** The individual changes, each one sentence. */
  lines: string[];
  /** For a changed processor block: both versions, so the view can overlay the curves. */
  block?: { type: string; before: Record<string, unknown> | null; after: Record<string, unknown> | null };
}

function* walk(node: PmNode): Generator<PmNode> {
  const stack = [node];
  while (stack.length) {
    const n = stack.pop()!;
    yield n;
    const children = n.content ?? [];
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]!);
  }
}

function textOf(node: PmNode): string {
  let text = '';
  for (const n of walk(node)) if (n.type === 'text') text += n.text ?? '';
  return text.trim();
}

const BLOCK_NAMES: Record<string, string> = { eqBlock: 'EQ', crossoverBlock: 'Crossover', delayBlock: 'Delays' };

function blocksOf(doc: PmNode) {
  return [...walk(doc)].filter((n) => (PROCESSOR_BLOCKS as readonly string[]).includes(n.type));
}

const labelOf = (n: PmNode) => (typeof n.attrs?.label === 'string' ? n.attrs.label : '');

function blockDiff(a: PmNode, b: PmNode): DocChange[] {
  const before = blocksOf(a);
  const after = blocksOf(b);
  const used = new Set<number>();
  const out: DocChange[] = [];
  // Pair by type and description first, then by type in order, so reordering is not a rewrite.
  const partner = (n: PmNode) => {
    let i = before.findIndex((m, j) => !used.has(j) && m.type === n.type && labelOf(m) === labelOf(n));
    if (i < 0) i = before.findIndex((m, j) => !used.has(j) && m.type === n.type);
    if (i >= 0) used.add(i);
    return i >= 0 ? before[i]! : null;
  };
  for (const n of after) {
    const old = partner(n);
    const name = `${BLOCK_NAMES[n.type]}${labelOf(n) ? ` "${labelOf(n)}"` : ''}`;
    if (!old) {
      out.push({ kind: 'block', title: `${name} block added`, lines: [], block: { type: n.type, before: null, after: n.attrs ?? {} } });
      continue;
    }
    const lines = blockChanges(n.type, old.attrs ?? {}, n.attrs ?? {});
    if (lines.length) out.push({ kind: 'block', title: `${name}: ${lines.length} ${lines.length === 1 ? 'change' : 'changes'}`, lines, block: { type: n.type, before: old.attrs ?? {}, after: n.attrs ?? {} } });
  }
  before.forEach((m, j) => {
    if (!used.has(j)) out.push({ kind: 'block', title: `${BLOCK_NAMES[m.type]}${labelOf(m) ? ` "${labelOf(m)}"` : ''} block removed`, lines: [], block: { type: m.type, before: m.attrs ?? {}, after: null } });
  });
  return out;
}

function tableCells(table: PmNode): string[][] {
  return (table.content ?? []).map((row) => (row.content ?? []).map(textOf));
}

function tableDiff(a: PmNode, b: PmNode): DocChange[] {
  const ta = [...walk(a)].filter((n) => n.type === 'table').map(tableCells);
  const tb = [...walk(b)].filter((n) => n.type === 'table').map(tableCells);
  const out: DocChange[] = [];
  for (let t = 0; t < Math.max(ta.length, tb.length); t++) {
    const x = ta[t];
    const y = tb[t];
    const name = `Table ${t + 1}`;
    if (!x || !y) {
      out.push({ kind: 'table', title: `${name} ${x ? 'removed' : 'added'}`, lines: [] });
      continue;
    }
    const header = y[0] ?? x[0] ?? [];
    const lines: string[] = [];
    for (let r = 0; r < Math.max(x.length, y.length); r++) {
      const rx = x[r];
      const ry = y[r];
      const rowName = `row ${r + 1}${(ry ?? rx)![0] ? ` (${(ry ?? rx)![0]})` : ''}`;
      if (!rx || !ry) {
        lines.push(`${rowName} ${rx ? 'removed' : 'added'}: ${(rx ?? ry)!.join(' | ')}`);
        continue;
      }
      for (let c = 0; c < Math.max(rx.length, ry.length); c++) {
        if ((rx[c] ?? '') === (ry[c] ?? '')) continue;
        const column = header[c] && r > 0 ? `column "${header[c]}"` : `column ${c + 1}`;
        lines.push(`${rowName}, ${column}: "${rx[c] ?? ''}" → "${ry[c] ?? ''}"`);
      }
    }
    if (lines.length) out.push({ kind: 'table', title: `${name}: ${lines.length} ${lines.length === 1 ? 'cell' : 'cells'} changed`, lines });
  }
  return out;
}

function photoDiff(a: PmNode, b: PmNode): DocChange[] {
  const photos = (doc: PmNode) => [...walk(doc)].filter((n) => n.type === 'image').map((n) => ({ src: String(n.attrs?.src ?? ''), alt: String(n.attrs?.alt ?? '') }));
  const pa = photos(a);
  const pb = photos(b);
  const lines: string[] = [];
  const name = (p: { src: string; alt: string }) => (p.alt ? `"${p.alt}"` : p.src);
  const left = [...pa];
  for (const p of pb) {
    const i = left.findIndex((q) => q.src === p.src);
    if (i >= 0) {
      if (left[i]!.alt !== p.alt) lines.push(`Photo description "${left[i]!.alt}" → "${p.alt}"`);
      left.splice(i, 1);
    } else lines.push(`Photo added: ${name(p)}`);
  }
  for (const p of left) lines.push(`Photo removed: ${name(p)}`);
  return lines.length ? [{ kind: 'photo', title: `Photos: ${lines.length} ${lines.length === 1 ? 'change' : 'changes'}`, lines }] : [];
}

function links(doc: PmNode): { text: string; href: string }[] {
  const out: { text: string; href: string }[] = [];
  for (const n of walk(doc)) {
    if (n.type !== 'text') continue;
    const link = n.marks?.find((m) => m.type === 'link');
    if (link) out.push({ text: n.text ?? '', href: String(link.attrs?.href ?? '') });
  }
  return out;
}

function linkDiff(a: PmNode, b: PmNode): DocChange[] {
  const la = links(a);
  const lb = links(b);
  const lines: string[] = [];
  const left = [...la];
  for (const l of lb) {
    let i = left.findIndex((m) => m.text === l.text && m.href === l.href);
    if (i >= 0) {
      left.splice(i, 1);
      continue;
    }
    i = left.findIndex((m) => m.text === l.text);
    if (i >= 0) {
      lines.push(`Link "${l.text}" now points to ${l.href} (was ${left[i]!.href})`);
      left.splice(i, 1);
    } else lines.push(`Link added: "${l.text}" → ${l.href}`);
  }
  for (const l of left) lines.push(`Link removed: "${l.text}" (${l.href})`);
  return lines.length ? [{ kind: 'link', title: `Links: ${lines.length} ${lines.length === 1 ? 'change' : 'changes'}`, lines }] : [];
}

function checkDiff(a: PmNode, b: PmNode): DocChange[] {
  const tasks = (doc: PmNode) => [...walk(doc)].filter((n) => n.type === 'taskItem').map((n) => ({ text: textOf(n), checked: n.attrs?.checked === true }));
  const ta = tasks(a);
  const tb = tasks(b);
  const lines: string[] = [];
  const left = [...ta];
  for (const t of tb) {
    const i = left.findIndex((m) => m.text === t.text);
    if (i < 0) continue; // a new or reworded item shows in the text diff
    if (left[i]!.checked !== t.checked) lines.push(`${t.checked ? 'Ticked' : 'Unticked'}: "${t.text}"`);
    left.splice(i, 1);
  }
  return lines.length ? [{ kind: 'check', title: `Checklist: ${lines.length} ${lines.length === 1 ? 'tick' : 'ticks'} changed`, lines }] : [];
}

/** Every structural change from `before` to `after`; empty only when the two documents are identical. */
export function structuralDiff(before: PmNode, after: PmNode, textChanged = false): DocChange[] {
  const changes = [...blockDiff(before, after), ...tableDiff(before, after), ...photoDiff(before, after), ...linkDiff(before, after), ...checkDiff(before, after)];
  if (changes.length === 0 && !textChanged && JSON.stringify(before) !== JSON.stringify(after)) {
    changes.push({ kind: 'format', title: 'Formatting or layout changed', lines: ['The words are the same; styles, headings, lists or the order of parts differ.'] });
  }
  return changes;
}
