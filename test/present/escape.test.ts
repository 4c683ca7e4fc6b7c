// Escaping per the XML 1.0 specification (W3C, 5th ed., §2.4 character data and §2.2 characters: '<' and
// '&' never literal in text, quotes escaped in attribute values, C0 controls other than tab, LF and CR not
// allowed) and the JSON text grammar (RFC 8259 §7: any character may be written as a \u escape).

import { describe, expect, it } from 'vitest';
import { cleanText, escapeJsonMarkup, escapeXml } from '../../src/present/escape.js';

describe('escapeXml', () => {
  it('escapes text for SVG and HTML, quotes included, and drops XML-forbidden controls', () => {
    expect(escapeXml(`<script>"&'`)).toBe('&lt;script&gt;&quot;&amp;&#39;');
    expect(escapeXml('a\u0000b\u001Fc\td')).toBe('abc\td');
  });

  it('escapes an ampersand once, whatever follows it', () => {
    expect(escapeXml('&amp; &lt;')).toBe('&amp;amp; &amp;lt;');
  });
});

describe('cleanText', () => {
  it('drops only the forbidden controls and leaves markup to the renderer', () => {
    expect(cleanText('<b>\u0007x\ny\u000B</b>')).toBe('<b>x\ny</b>');
  });
});

describe('escapeJsonMarkup', () => {
  it('parses back to the same value, with no <, > or & left in the text', () => {
    const value = { t: '</script><!-- & \u2028\u2029 -->' };
    const text = escapeJsonMarkup(JSON.stringify(value));
    expect(text).not.toMatch(/[<>&\u2028\u2029]/);
    expect(JSON.parse(text)).toEqual(value);
  });
});
