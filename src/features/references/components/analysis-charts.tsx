import { useEffect, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { Button } from '../../../components/ui/button';
import type { Molecule } from '../../../shared/chem';
import type { Term } from '../../../shared/references';
import { useAnalysis } from '../api/get-analyses';
import { TermBeadsView, type PickedTerm } from './term-beads-view';

// Each term of an analysis: its histogram (bars), the Gaussian of its mean and sd (the harmonic fit
// whose k the table gives), and the Boltzmann-inverted potential on the right axis. A second analysis
// chosen at the same time is drawn over it, term by term (matched by bead names). Picking a term (its
// chart, its "Show beads" button or its row in the term list) shows its beads on the analysed state's
// drawing and bead graph beside the charts.

const INK = '#1f4e5a';
const SECOND = '#c2762b';
const FIT = '#5b8a3a';

function gaussian(t: Term, x: number[], total: number): number[] {
  const w = t.histogram.edges[1] - t.histogram.edges[0];
  return x.map((v) => (t.sd > 0 ? (total * w * Math.exp(-((v - t.mean) ** 2) / (2 * t.sd ** 2))) / (t.sd * Math.sqrt(2 * Math.PI)) : 0));
}

const termKey = (kind: string, t: Pick<Term, 'beadIds'>) => `${kind}:${t.beadIds.join('-')}`;
const termLabel = (kind: string, t: Term) => `${kind} ${t.beads.join('–')}`;

function TermChart({ kind, term, other, picked, onPick }: { kind: string; term: Term; other?: Term; picked: boolean; onPick(): void }) {
  const el = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!el.current) return;
    const x = term.potential.x;
    const total = term.histogram.counts.reduce((s, c) => s + c, 0);
    const data: uPlot.AlignedData = [x, term.histogram.counts, gaussian(term, x, total), term.potential.u.map((u) => u ?? null)];
    const series: uPlot.Series[] = [
      {},
      { label: 'count', stroke: INK, fill: 'rgba(31,78,90,0.15)', paths: uPlot.paths.stepped!({ align: 1 }) },
      { label: 'harmonic fit', stroke: FIT, dash: [4, 4] },
      { label: 'U (kJ/mol)', stroke: '#7a2e46', scale: 'u' },
    ];
    if (other) {
      // The second analysis on this term's bins (nearest bin centre), counts scaled to the same total.
      const otherTotal = other.histogram.counts.reduce((s, c) => s + c, 0) || 1;
      const at = (v: number) => {
        const e = other.histogram.edges;
        const b = Math.floor(((v - e[0]) / (e[e.length - 1] - e[0])) * (e.length - 1));
        return b >= 0 && b < other.histogram.counts.length ? (other.histogram.counts[b] * total) / otherTotal : null;
      };
      data.push(x.map(at));
      series.push({ label: 'other analysis', stroke: SECOND, paths: uPlot.paths.stepped!({ align: 1 }) });
    }
    const unit = kind === 'bond' ? 'nm' : 'degrees';
    const plot = new uPlot(
      {
        width: 360,
        height: 200,
        title: `${term.beads.join('–')}: ${term.mean.toFixed(kind === 'bond' ? 3 : 1)} ± ${term.sd.toFixed(kind === 'bond' ? 3 : 1)} ${unit}${term.k !== null ? `, k = ${term.k.toPrecision(4)}` : ''}`,
        scales: { x: { time: false }, u: { auto: true } },
        axes: [{ label: unit }, { label: 'count' }, { scale: 'u', side: 1, label: 'U (kJ/mol)' }],
        series,
      },
      data,
      el.current,
    );
    return () => plot.destroy();
  }, [kind, term, other]);
  return (
    <div className={`flex flex-col items-start gap-1 rounded p-1 ${picked ? 'ring-2 ring-ink-600' : ''}`}>
      {/* A click on the chart picks its term; the button does the same from the keyboard. */}
      <figure ref={el} onClick={onPick} className="cursor-pointer" aria-label={`${kind} ${term.beads.join('-')}: mean ${term.mean}, standard deviation ${term.sd}`} />
      <Button size="sm" variant={picked ? 'secondary' : 'ghost'} aria-pressed={picked} onClick={onPick}>
        {picked ? 'Beads shown' : 'Show beads'} <span className="sr-only">of the {termLabel(kind, term)}</span>
      </Button>
    </div>
  );
}

export default function AnalysisCharts({ ids, molecule }: { ids: number[]; molecule: Pick<Molecule, 'atoms' | 'bonds'> }) {
  const first = useAnalysis(ids[0]);
  const second = useAnalysis(ids[1] ?? null);
  const [picked, setPicked] = useState<(PickedTerm & { key: string }) | null>(null);
  const r = first.data?.result;
  if (!r || !first.data) return <p className="text-ink-600">Loading the distributions…</p>;
  const { mappingId, versionNumber } = first.data;
  const pick = (kind: string, t: Term) => setPicked((p) => (p?.key === termKey(kind, t) ? null : { key: termKey(kind, t), kind, beads: t.beads, beadIds: t.beadIds }));
  const match = (kind: 'bonds' | 'angles' | 'dihedrals', t: Term) => second.data?.result?.[kind].find((o) => o.beads.join('-') === t.beads.join('-'));
  const groups = [['bond', 'bonds'], ['angle', 'angles'], ['dihedral', 'dihedrals']] as const;
  const all = groups.flatMap(([kind, key]) => r[key].map((t) => ({ kind, t })));
  return (
    <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,1fr)_18rem]">
      <div className="flex min-w-0 flex-col gap-4">
        <p className="text-ink-700">
          {r.frames} frames × {r.copies} copies{ids[1] !== undefined && ' — the second analysis is drawn in orange'}.
        </p>
        {groups.map(([kind, key]) =>
          r[key].length > 0 ? (
            <section key={key} aria-label={`${key} distributions`}>
              <h3 className="font-semibold capitalize text-ink-900">{key}</h3>
              <div className="flex flex-wrap gap-3">
                {r[key].map((t) => <TermChart key={t.beadIds.join('-')} kind={kind} term={t} other={match(key, t)} picked={picked?.key === termKey(kind, t)} onPick={() => pick(kind, t)} />)}
              </div>
            </section>
          ) : null,
        )}
      </div>
      <aside className="flex flex-col gap-3 lg:sticky lg:top-4">
        <ul aria-label="Terms" className="flex max-h-56 flex-col gap-0.5 overflow-auto rounded border border-paper-300 p-1">
          {all.map(({ kind, t }) => {
            const on = picked?.key === termKey(kind, t);
            return (
              <li key={termKey(kind, t)}>
                <button type="button" aria-pressed={on} onClick={() => pick(kind, t)} className={`w-full rounded px-2 py-0.5 text-left hover:bg-ink-50 focus-visible:outline-2 focus-visible:outline-ink-700 ${on ? 'bg-ink-100 font-semibold' : ''}`}>
                  {termLabel(kind, t)} <span className="text-ink-600">{t.mean.toFixed(kind === 'bond' ? 3 : 1)} ± {t.sd.toFixed(kind === 'bond' ? 3 : 1)}</span>
                </button>
              </li>
            );
          })}
        </ul>
        {picked ? (
          <TermBeadsView term={picked} mappingId={mappingId} versionNumber={versionNumber} molecule={molecule} />
        ) : (
          <p className="text-ink-600">Pick a term (its chart or the list) to see its beads on the drawing and the bead graph.</p>
        )}
      </aside>
    </div>
  );
}
