import { describe, expect, it } from 'vitest';
import { assertInert, finishSvg } from '../../src/charts/svg-finish.js';

const raw = (clip: string, label: string) =>
  `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1" class="marks" width="640" height="320" viewBox="0 0 640 320">` +
  `<defs><clipPath id="${clip}"><rect x="0" y="0" width="540.123456" height="250"/></clipPath></defs>` +
  `<g class="mark-line role-mark" role="graphics-symbol" aria-roledescription="line mark container" clip-path="url(#${clip})"><path d="M0.30000000000000004,1.23456L-0.0001,2"/></g>` +
  `<g class="mark-text"><text transform="translate(3,4)">${label}</text></g></svg>`;
const text = { title: 'T', description: 'D' };

describe('finishing vega’s SVG', () => {
  it('makes an accessible image: role, title and desc named by aria-labelledby, a viewBox', () => {
    const svg = finishSvg(raw('clip1', 'x'), { title: `<b>"A&B"</b>`, description: `it's <i>` }, { width: 640, height: 320 });
    const root = /^<svg [^>]*>/.exec(svg)![0];
    expect(root).toContain('role="img"');
    expect(root).toContain('viewBox="0 0 640 320"');
    const [, t, d] = /aria-labelledby="([^ "]+) ([^"]+)"/.exec(root)!;
    expect(svg).toContain(`<title id="${t}">&lt;b&gt;&quot;A&amp;B&quot;&lt;/b&gt;</title>`);
    expect(svg).toContain(`<desc id="${d}">it&#39;s &lt;i&gt;</desc>`);
    expect(root).not.toContain('xlink');
    expect(svg).not.toMatch(/ class=| role="graphics| aria-roledescription/);
  });

  it('names ids after the chart, not after vega’s process-wide counter', () => {
    const a = finishSvg(raw('clip1', 'x'), text, { width: 640, height: 320 });
    const b = finishSvg(raw('clip97', 'x'), text, { width: 640, height: 320 });
    expect(a).toBe(b);
    const id = /<clipPath id="([^"]+)"/.exec(a)![1];
    expect(id).toMatch(/^zc[0-9a-f]{10}-1$/);
    expect(a).toContain(`clip-path="url(#${id})"`);
    // A different chart gets different ids, so two charts inline on one page never collide.
    const c = finishSvg(raw('clip1', 'y'), text, { width: 640, height: 320 });
    expect(/<clipPath id="([^"]+)"/.exec(c)![1]).not.toBe(id);
  });

  it('rounds coordinates to 1/10 px and leaves text content alone', () => {
    const label = 'R = 0.123456 Ω id="clip1" url(#clip1) href=x @1@';
    const svg = finishSvg(raw('clip1', label.replace(/&/g, '&amp;')), text, { width: 640, height: 320 });
    expect(svg).toContain('d="M0.3,1.2L0,2"');
    expect(svg).toContain('width="540.1"');
    expect(svg).toContain(`>${label.replace('Ω', '&#937;')}</text>`);
  });

  it('writes characters beyond Latin-1 as character references, so the string is one byte a character', () => {
    const svg = finishSvg(raw('clip1', '−90° to 1 kΩ 𝑓'), { title: 'Z → Ω', description: 'D' }, { width: 640, height: 320 });
    expect(/[^\x00-\xff]/.test(svg)).toBe(false);
    // Unicode code points: U+2212 minus, U+03A9 omega, U+2192 arrow, U+1D453 italic f (one reference, not two halves).
    expect(svg).toContain('>&#8722;90° to 1 k&#937; &#119891;</text>');
    expect(svg).toContain('>Z &#8594; &#937;</title>');
  });

  it('draws an underlay first in the plot, under its axes and marks, and refuses one with no plot to go in', () => {
    const plotted =
      `<svg xmlns="http://www.w3.org/2000/svg" class="marks" width="100" height="80" viewBox="0 0 100 80"><g fill="none" transform="translate(10,5)">` +
      `<g class="mark-group role-frame root" role="graphics-object"><g transform="translate(0,0)"><path class="background" aria-hidden="true" d="M0,0h80v60h-80Z"/><g>` +
      `<g class="mark-group role-axis"><line x2="4" stroke="#000"/></g><g class="mark-line role-mark"><path d="M0,0L80,60" stroke="#123456"/></g></g></g></g></g></svg>`;
    const underlay = '<path d="M0,30H80" stroke="#ececec" stroke-width="0.6"/>';
    const svg = finishSvg(plotted, text, { width: 100, height: 80 }, underlay);
    expect(svg).toContain(`<g transform="translate(0,0)"><g>${underlay}<g><line`);
    expect(svg.indexOf(underlay)).toBeLessThan(svg.indexOf('stroke="#123456"'));
    expect(() => finishSvg(raw('clip1', 'x'), text, { width: 640, height: 320 }, underlay)).toThrow(/no plot/);
    // Without an underlay, a chart with no plot group finishes as before.
    expect(finishSvg(raw('clip1', 'x'), text, { width: 640, height: 320 })).toContain('<text');
  });

  it('refuses markup that could run or load anything', () => {
    expect(() => assertInert('<g><script></script></g>')).toThrow(/active or external/);
    expect(() => assertInert('<a href="x"></a>')).toThrow();
    expect(() => assertInert('<rect onload="x"/>')).toThrow();
    expect(() => assertInert('<rect fill="url(https://example.org/x)"/>')).toThrow();
    expect(() => assertInert('<image/>')).toThrow();
    expect(() => assertInert('<g clip-path="url(#zc1-1)"><path d="M0,0"/></g>')).not.toThrow();
    expect(() => finishSvg(raw('c', 'x').replace('<g class="mark-text">', '<foreignObject>'), text, { width: 1, height: 1 })).toThrow();
  });
});
