// vega measures text with textWidth (text-width.ts) rather than its own guess of 0.8 em a character. Kept
// apart from the widths themselves, which pages use without loading vega.

import { vega } from './vega-runtime.js';
import { textWidth } from './text-width.js';

let installed = false;

/** Make vega measure text with this estimate (process-wide; idempotent). */
export function installTextMetrics(): void {
  if (installed) return;
  installed = true;
  // Exported by vega (from vega-scenegraph) but missing from its type declarations.
  const metrics = (vega as unknown as { textMetrics: { width: (item: { fontSize?: number }, text: unknown) => number } }).textMetrics;
  metrics.width = (item, text) => {
    const size = item.fontSize != null ? Number(item.fontSize) || 0 : 11;
    return textWidth(text == null ? '' : String(text).trim(), size);
  };
}
