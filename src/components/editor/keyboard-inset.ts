import { useEffect } from 'react';

/**
 * How far the on-screen keyboard covers the bottom of the layout viewport. Browsers that shrink
 * the layout for the keyboard (the `interactive-widget=resizes-content` viewport setting) give 0;
 * those that only shrink the visual viewport leave the sticky save bar under the keys, and this is
 * how far to lift it.
 */
export function keyboardInset(layoutHeight: number, view: { height: number; offsetTop: number }): number {
  const covered = layoutHeight - view.height - view.offsetTop;
  // Sub-pixel rounding and the browser's own bars move a few pixels; only a keyboard moves this much.
  return covered > 80 ? Math.round(covered) : 0;
}

/** Keeps --tl-keyboard-inset on the document up to date while the editor is open. */
export function useKeyboardInset(): void {
  useEffect(() => {
    const view = window.visualViewport;
    if (!view) return;
    const root = document.documentElement;
    const update = () => root.style.setProperty('--tl-keyboard-inset', `${keyboardInset(window.innerHeight, view)}px`);
    update();
    view.addEventListener('resize', update);
    view.addEventListener('scroll', update);
    return () => {
      view.removeEventListener('resize', update);
      view.removeEventListener('scroll', update);
      root.style.removeProperty('--tl-keyboard-inset');
    };
  }, []);
}
