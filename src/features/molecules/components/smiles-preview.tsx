import { useEffect, useMemo, useRef, useState } from 'react';
import SmilesDrawer from 'smiles-drawer';
import { debounce } from 'throttle-debounce';

/**
 * An instant drawing of the SMILES being typed. It is only a preview: smiles-drawer is lenient
 * (it accepts some strings the server refuses), so the server's answer on submit is the verdict.
 */
export function SmilesPreview({ smiles }: { smiles: string }) {
  const svg = useRef<SVGSVGElement>(null);
  const [problem, setProblem] = useState<string | null>(null);

  // Draws 120 ms after the last keystroke, not on every one (smiles-drawer re-lays the whole structure).
  const draw = useMemo(
    () =>
      debounce(120, (el: SVGSVGElement, text: string) => {
        const drawer = new SmilesDrawer.SvgDrawer({ width: 320, height: 220, padding: 12, compactDrawing: false });
        SmilesDrawer.parse(
          text,
          (tree) => {
            try {
              drawer.draw(tree, el, 'light');
              setProblem(null);
            } catch {
              setProblem('The preview cannot draw this yet.');
            }
          },
          () => setProblem('Not readable as SMILES yet.'),
        );
      }),
    [],
  );

  useEffect(() => {
    const el = svg.current;
    if (!el) return;
    while (el.firstChild) el.removeChild(el.firstChild);
    if (!smiles.trim()) return setProblem(null);
    draw(el, smiles.trim());
    return () => draw.cancel();
  }, [smiles, draw]);

  return (
    <figure className="flex flex-col gap-1">
      <div className="flex h-[220px] w-[320px] items-center justify-center rounded-md border border-paper-300 bg-paper-50">
        <svg ref={svg} role="img" aria-label={smiles ? `Preview of ${smiles}` : 'Empty preview'} width={320} height={220} className={problem || !smiles ? 'hidden' : ''} />
        {(problem || !smiles) && <p className="px-4 text-center text-sm text-ink-600">{problem ?? 'The structure appears here as you type.'}</p>}
      </div>
      <figcaption className="text-xs text-ink-600">Quick preview while typing; the server checks the structure when you add it.</figcaption>
    </figure>
  );
}
