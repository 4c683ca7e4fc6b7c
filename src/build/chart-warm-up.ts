// Charts drawn once in this thread, of two invented parts, and thrown away: the first charts a thread draws
// pay for compiling each chart kind's View (render.ts) and for the drawing code's first runs. `zfolio serve`
// draws them after its first build, whose charts its worker drew, so that the first edit's rebuild (which
// draws its few charts in this thread: BuildOptions.warm) does not pay for them. Each View draws one chart at
// a time, so an edit saved meanwhile waits at most for the chart in progress, and the output of any chart
// does not depend on what its View drew before (render.ts).

import { analysePart } from '../analysis/part-figures.js';
import { DiagnosticList, formatDiagnostic } from '../model/diagnostics.js';
import { readPart } from '../model/part.js';
import { DEFAULT_SETTINGS } from '../model/settings.js';
import { parseYamlSource } from '../model/source.js';
import { chartInput, comparisonInput } from './chart-jobs.js';
import { loadChartDrawing } from './chart-pool.js';

/**
 * Two invented capacitors, written as part files are: a tolerance (so the spread is drawn, as for most
 * library parts), parasitics and a DC-bias table. Their values are typical of the kind, from no maker.
 */
const INVENTED = [
  'id: WARM-UP-100N\nkind: capacitor\nnominal: 100n\ntolerance: 10%\nvoltage: 16V\ndielectric: X7R\nparasitics: {esr: 20m, esl: 0.45n}\ndc-bias: {1V: 97%, 5V: 72%}\n',
  'id: WARM-UP-10U\nkind: capacitor\nnominal: 10u\ntolerance: 20%\nvoltage: 6.3V\ndielectric: X5R\nparasitics: {esr: 5m, esl: 0.6n}\n',
];

/** Draws a part's charts and a comparison of the two parts in this thread; resolves once they are drawn. */
export async function warmChartDrawing(): Promise<void> {
  const { renderChartJob } = await loadChartDrawing();
  const { sweep, within, temperature } = DEFAULT_SETTINGS;
  const analyses = INVENTED.map((text, i) => {
    const diagnostics = new DiagnosticList();
    const source = parseYamlSource(`warm-up-${i}.yaml`, text, diagnostics);
    const part = source && readPart({ source, diagnostics });
    if (!part || diagnostics.errorCount > 0) throw new Error(`the warm-up part ${i} does not read: ${diagnostics.sorted().map(formatDiagnostic).join('; ')}`);
    return analysePart(part, sweep, within, temperature);
  });
  await renderChartJob({ type: 'part', input: chartInput(analyses[0]) });
  await renderChartJob({ type: 'comparison', inputs: analyses.map(comparisonInput), title: 'warm-up' });
}
