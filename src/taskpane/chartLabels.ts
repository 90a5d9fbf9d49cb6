// Where a chart's mark labels go, as plain numbers (no DOM), so it can be tested in Node.

/** Chart text size, px: the Office caption size, drawn 1:1 because the chart is drawn at its container's width. */
export const FONT_PX = 12;
/** Height of one line of mark labels, px. */
export const LINE_PX = 14;

/** A mark's label and where it goes: a line of its own when it would touch a neighbour. */
export interface PlacedLabel { x: number; text: string; cls: string; line: number; anchor: 'start' | 'end' }

/**
 * Places vertical marks' labels so none overlaps another: left to right, each label on the first line where it
 * clears every label already there (text width estimated at 0.6 em per character, generous for digits and lower case).
 * A label that would run past the right edge is drawn to the left of its mark.
 */
export function placeMarkLabels(marks: { x: number; text: string; cls: string }[], plotRight: number, fontPx = FONT_PX): PlacedLabel[] {
  const lines: [number, number][][] = [];
  return [...marks].sort((a, b) => a.x - b.x).map((m) => {
    const width = m.text.length * fontPx * 0.6 + 2;
    const anchor = m.x + 3 + width > plotRight ? 'end' : 'start';
    const span: [number, number] = anchor === 'start' ? [m.x + 3, m.x + 3 + width] : [m.x - 3 - width, m.x - 3];
    let line = lines.findIndex((used) => used.every(([a, b]) => span[1] + 4 <= a || span[0] >= b + 4));
    if (line < 0) { lines.push([]); line = lines.length - 1; }
    lines[line].push(span);
    return { x: m.x, text: m.text, cls: m.cls, line, anchor };
  });
}

