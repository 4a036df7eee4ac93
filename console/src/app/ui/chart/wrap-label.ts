/**
 * A long category label (an API route, say) as lines of at most `maxChars`, broken after a slash or a
 * space where it can be and inside a word only where a part is longer than a line. The axis then shows
 * the whole label on a few short lines instead of a narrow plot or a label cut at the canvas edge.
 */
export function wrapLabel(label: string, maxChars: number): string[] {
  const parts = label.split(/(?<=[/ ])/);
  const lines: string[] = [];
  let line = '';
  for (let part of parts) {
    while (part.length > maxChars) {
      if (line) {
        lines.push(line.trimEnd());
        line = '';
      }
      lines.push(part.slice(0, maxChars));
      part = part.slice(maxChars);
    }
    if (line && (line + part).trimEnd().length > maxChars) {
      lines.push(line.trimEnd());
      line = '';
    }
    line += part;
  }
  if (line.trim() || !lines.length) lines.push(line.trimEnd());
  return lines;
}
