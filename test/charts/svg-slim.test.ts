import { describe, expect, it } from 'vitest';
import { slimSvgBody } from '../../src/charts/svg-slim.js';

// Initial values from the SVG 1.1 property index (opacity 1, stroke-miterlimit 4, stroke-dasharray none)
// and SVG 2 §13 (a path with an empty "d" renders nothing).
describe('dropping markup that draws nothing', () => {
  const font = "Helvetica, Arial, 'Liberation Sans', sans-serif";

  it('drops attributes at their initial value, in tags only, never in text', () => {
    const body = `<g fill="none" stroke-miterlimit="4"><line x2="4" stroke="#111" opacity="1" stroke-dasharray=""/><text font-family="${font}"> opacity="1" stroke-dasharray=""</text></g>`;
    const { body: out } = slimSvgBody(body);
    expect(out).toBe('<g fill="none"><line x2="4" stroke="#111"/><text> opacity="1" stroke-dasharray=""</text></g>');
  });

  it('says a shared font family once, and leaves several alone', () => {
    const one = slimSvgBody(`<g fill="none"><text font-family="${font}">a</text><text font-family="${font}" font-size="10px">b</text></g>`);
    expect(one.fontFamily).toBe(font);
    expect(one.body).toBe('<g fill="none"><text>a</text><text font-size="10px">b</text></g>');
    const two = slimSvgBody(`<g fill="none"><text font-family="A">a</text><text font-family="B">b</text></g>`);
    expect(two.fontFamily).toBeUndefined();
    expect(two.body).toContain('font-family="A"');
  });

  it('drops empty and hidden paths, zero-size backgrounds and groups left empty', () => {
    const body = '<g fill="none"><g><path d="" display="none"/></g><g transform="translate(1,2)"><path d="M0,0h0v0h0Z"/><g/></g><path d="M1,1L2,2" stroke="#000"/></g>';
    expect(slimSvgBody(body).body).toBe('<g fill="none"><path d="M1,1L2,2" stroke="#000"/></g>');
  });

  it('drops a group background without fill or stroke under fill="none", and keeps it where a group fills', () => {
    expect(slimSvgBody('<g fill="none"><g><path d="M0,0h234v120h-234Z"/><path d="M1,1L2,2" stroke="#000"/></g></g>').body).toBe('<g fill="none"><g><path d="M1,1L2,2" stroke="#000"/></g></g>');
    const filled = '<g fill="none"><g fill="#eee"><path d="M0,0h234v120h-234Z"/></g></g>';
    expect(slimSvgBody(filled).body).toBe(filled);
    // After the chart's background rectangle (vega writes it first, beside the root group, not above it).
    const paper = '<rect width="332" height="260" fill="#ffffff"/>';
    expect(slimSvgBody(`${paper}<g fill="none"><g><path d="M0,0h234v120h-234Z"/><path d="M1,1L2,2" stroke="#000"/></g></g>`).body).toBe(`${paper}<g fill="none"><g><path d="M1,1L2,2" stroke="#000"/></g></g>`);
    expect(slimSvgBody(`${paper}${filled}`).body).toBe(`${paper}${filled}`);
  });

  it('keeps one of each clip rectangle and points every use at it', () => {
    const body =
      '<g fill="none"><g clip-path="url(#a)"><path d="M1,1L2,2"/></g><g clip-path="url(#b)"><path d="M3,3L4,4"/></g><g clip-path="url(#c)"><path d="M5,5L6,6"/></g></g>' +
      '<defs><clipPath id="a"><rect x="0" y="0" width="10" height="5"/></clipPath><clipPath id="b"><rect x="0" y="0" width="10" height="5"/></clipPath><clipPath id="c"><rect x="0" y="0" width="9" height="5"/></clipPath></defs>';
    const out = slimSvgBody(body).body;
    expect(out.match(/<clipPath /g)).toHaveLength(2);
    expect(out).toContain('<g clip-path="url(#a)"><path d="M3,3L4,4"/>');
    expect(out).toContain('<g clip-path="url(#c)">');
    expect(out).not.toContain('#b');
  });

  it('draws a group of lines drawn alike (the ticks of an axis) as one path of the same segments; dashed or unlike lines stay', () => {
    const ticks = '<line transform="translate(0,0)" x2="0" y2="4" stroke="#1b1b1b" stroke-width="0.8"/><line transform="translate(58.5,-2)" x2="-4" y2="0" stroke="#1b1b1b" stroke-width="0.8"/><line transform="translate(3,4)" x2="26" y2="-1.5" stroke="#1b1b1b" stroke-width="0.8"/>';
    // Each segment from (x, y) to (x + x2, y + y2), relative to its start: v and h where it is upright or level.
    expect(slimSvgBody(`<g fill="none"><g>${ticks}</g><text>1</text></g>`).body).toBe('<g fill="none"><path d="M0,0v4M58.5,-2h-4M3,4l26,-1.5" stroke="#1b1b1b" stroke-width="0.8"/><text>1</text></g>');
    const unlike = '<g><line transform="translate(0,0)" x2="26" y2="0" stroke="#1f3d73" stroke-width="1.6"/><line transform="translate(63,0)" x2="26" y2="0" stroke="#b5520b" stroke-width="1.6"/></g>';
    const dashed = '<g><line transform="translate(1,0)" x2="0" y2="9" stroke="#4f6f91" stroke-dasharray="4,2"/><line transform="translate(5,0)" x2="0" y2="9" stroke="#4f6f91" stroke-dasharray="4,2"/></g>';
    const single = '<g><line transform="translate(1,0)" x2="0" y2="9" stroke="#4f6f91"/></g>';
    for (const kept of [unlike, dashed, single]) expect(slimSvgBody(`<g fill="none">${kept}</g>`).body).toBe(`<g fill="none">${kept}</g>`);
  });
});
