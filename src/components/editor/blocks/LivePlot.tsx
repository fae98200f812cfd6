import { useMemo, useRef } from 'react';

/**
 * The block's curve, computed on this device by the same code the server draws the read view with.
 * A value that cannot be drawn leaves the last good curve up.
 */
export function LivePlot({ draw, deps }: { draw: () => string; deps: unknown }) {
  const last = useRef('');
  const svg = useMemo(() => {
    try {
      last.current = draw();
    } catch {
      // Keep the previous curve; the field shows what is wrong.
    }
    return last.current;
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [deps]);
  // Safe: the SVG is built from numbers, and every label in it is escaped by responseSvg.
  return <div className="my-2" data-testid="block-live-plot" dangerouslySetInnerHTML={{ __html: svg }} />;
}
