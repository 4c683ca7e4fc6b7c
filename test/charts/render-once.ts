// Run as its own process by render.test.ts: renders the demo capacitor's four charts and prints their SHA-256
// hashes as JSON, so the test can compare bytes across processes.

import { createHash } from 'node:crypto';
import { renderPartCharts } from '../../src/charts/part-charts.js';
import { analysed, capacitorPart } from './fixtures.js';

const charts = await renderPartCharts(analysed(capacitorPart));
const hashes = Object.fromEntries(Object.entries(charts).map(([k, c]) => [k, createHash('sha256').update(c.svg).digest('hex')]));
process.stdout.write(JSON.stringify(hashes));
