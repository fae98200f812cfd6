import { useMemo } from 'react';
import type { DocChange } from '~/lib/doc/structural-diff';
import { CROSSOVER_BLOCK, EQ_BLOCK, type CrossoverBlockAttrs, type EqBlockAttrs } from '~/lib/doc/blocks/block-data';
import { crossoverPlotSvg, eqPlotSvg } from '~/lib/doc/render-blocks';

/** Before and after curves of a changed block, drawn by the same code as the read view. */
function Overlay({ change, id }: { change: DocChange; id: string }) {
  const svg = useMemo(() => {
    const b = change.block;
    if (!b?.before || !b.after) return null;
    try {
      if (b.type === EQ_BLOCK) return eqPlotSvg(b.after as unknown as EqBlockAttrs, id, b.before as unknown as EqBlockAttrs);
      if (b.type === CROSSOVER_BLOCK) return crossoverPlotSvg(b.after as unknown as CrossoverBlockAttrs, id, b.before as unknown as CrossoverBlockAttrs);
    } catch {
      return null;
    }
    return null;
  }, [change, id]);
  if (!svg) return null;
  // Safe: the SVG is built from numbers, and every label in it is escaped by responseSvg.
  return <div className="mt-2" data-testid="diff-curves" dangerouslySetInnerHTML={{ __html: svg }} />;
}

/** The structural changes between two revisions, one card per block, table, photo set, link set or checklist. */
export function StructuralChanges({ changes }: { changes: DocChange[] }) {
  if (changes.length === 0) return null;
  return (
    <ul className="mt-2 space-y-2" data-testid="structural-changes">
      {changes.map((c, i) => (
        <li key={i} className="rounded-lg border border-line bg-surface p-3" data-kind={c.kind}>
          <p className="font-semibold">{c.title}</p>
          {c.lines.length > 0 && (
            <ul className="mt-1 list-disc pl-5 text-sm tabular-nums">
              {c.lines.map((line, j) => (
                <li key={j}>{line}</li>
              ))}
            </ul>
          )}
          <Overlay change={c} id={`diff-${i}`} />
        </li>
      ))}
    </ul>
  );
}
