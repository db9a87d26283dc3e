/**
 * A fill for a pattern colour name. Colour names are free text from the catalogue ("Traffic
 * grey", "Signal yellow"), so the common colour words map to tones that read well on a plan and
 * anything else gets a stable hue generated from the name.
 */

/** Common words → tones; the first word found in the name wins (longer words are checked first). */
const KNOWN: ReadonlyArray<readonly [string, string]> = [
  ['anthracite', '#3b3f44'],
  ['charcoal', '#36393d'],
  ['graphite', '#4a4d52'],
  ['silver', '#b8bcc2'],
  ['orange', '#e07b28'],
  ['yellow', '#e8c229'],
  ['purple', '#7b4fa0'],
  ['violet', '#7b4fa0'],
  ['white', '#f2f2ef'],
  ['black', '#262626'],
  ['brown', '#7a5536'],
  ['beige', '#d8c7a5'],
  ['green', '#3f8f4f'],
  ['olive', '#6b7434'],
  ['cream', '#efe6cc'],
  ['grey', '#8a8d91'],
  ['gray', '#8a8d91'],
  ['blue', '#2f62a8'],
  ['navy', '#24365e'],
  ['teal', '#2b7f7a'],
  ['pink', '#d9789d'],
  ['sand', '#cdb88e'],
  ['red', '#b8322c'],
  ['tan', '#c4a27a'],
];

/** A stable 32-bit hash of the name (FNV-1a), so a colour keeps its hue between sessions. */
function hash(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/** An sRGB hex fill for the colour name: a known tone when the name contains a colour word. */
export function colourFill(name: string): string {
  const lower = name.toLowerCase();
  const words = lower.split(/[^a-z]+/).filter(Boolean);
  for (const [word, fill] of KNOWN) if (words.includes(word)) return fill;
  for (const [word, fill] of KNOWN) if (word.length >= 4 && lower.includes(word)) return fill;
  const h = hash(lower.trim());
  // Mid saturation and lightness so the tile joints and labels stay readable on every hue.
  return hslToHex(h % 360, 45 + ((h >>> 9) % 20), 45 + ((h >>> 17) % 15));
}

function hslToHex(h: number, s: number, l: number): string {
  const sat = s / 100;
  const light = l / 100;
  const a = sat * Math.min(light, 1 - light);
  const channel = (n: number): string => {
    const k = (n + h / 30) % 12;
    const c = light - a * Math.max(-1, Math.min(k - 3, 9 - k, 1));
    return Math.round(c * 255)
      .toString(16)
      .padStart(2, '0');
  };
  return `#${channel(0)}${channel(8)}${channel(4)}`;
}
