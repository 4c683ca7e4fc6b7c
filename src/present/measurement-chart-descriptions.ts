// Titles and text alternatives of the measurement charts: what is compared, over which range, and how far
// the model is from the measurement.

import { formatEng } from '../units/format.js';
import type { MeasurementChartData, MeasurementChartKind } from '../charts/measurement-charts.js';
import type { ChartText } from './chart-descriptions.js';

function range(data: MeasurementChartData): string {
  const f = data.frequencies;
  return `${formatEng(f[0], 'frequency')} to ${formatEng(f[f.length - 1], 'frequency')}`;
}

function worst(values: ArrayLike<number>): number {
  let at = 0;
  for (let k = 1; k < values.length; k++) if (Math.abs(values[k]) > Math.abs(values[at])) at = k;
  return at;
}

export function measurementChartText(kind: MeasurementChartKind, data: MeasurementChartData): ChartText {
  const r = data.residual;
  const source = `${data.file} (${data.fixture} fixture, ${data.frequencies.length} points, ${range(data)})`;
  const miss = `The model misses the measurement by ${r.rmsDb.toFixed(2)} dB rms in |Z| (at most ${r.maxDb.toFixed(2)} dB) and ${r.rmsDeg.toFixed(2)}° rms in phase.`;
  switch (kind) {
    case 'measured-impedance':
      return {
        title: `${data.partId}: |Z| of the model and as measured (${data.file})`,
        description: `Log-log chart of the model's |Z| and the measured |Z| of ${data.partId}, from ${source}. ${miss}`,
      };
    case 'measured-phase':
      return {
        title: `${data.partId}: phase of the model and as measured (${data.file})`,
        description: `Chart of the phase of Z, model and measured, of ${data.partId} from ${source}. ${miss}`,
      };
    case 'residual': {
      const k = worst(data.errorDb);
      return {
        title: `${data.partId}: model − measured (${data.file}), |Z| in dB and phase in degrees`,
        description: `Chart of the model's error against ${source}: 20·log10(|Z model|/|Z measured|) in dB and the phase difference in degrees. ${miss} The largest |Z| error, ${data.errorDb[k] >= 0 ? '+' : '−'}${Math.abs(data.errorDb[k]).toFixed(2)} dB, is at ${formatEng(data.frequencies[k], 'frequency')}.`,
      };
    }
  }
}
