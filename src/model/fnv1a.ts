/** FNV-1a, 32 bits, over the text's UTF-16 code units: a cheap, stable spread of names (shards, seeds). */
export function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return h >>> 0;
}
