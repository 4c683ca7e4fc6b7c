// Which complex plane a part's plane chart draws, known without drawing it (a page links the chart's spec
// by a name that says which).

/** Whether a part's complex-plane chart is its admittance circle (else its impedance path). */
export function drawsAdmittancePlane(part: { kind: string }): boolean {
  return part.kind === 'capacitor';
}
