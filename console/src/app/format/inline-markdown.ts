/** A run of text from an OpenAPI description, with the little inline markup those descriptions use. */
export interface TextRun {
  kind: 'text' | 'code' | 'em' | 'strong' | 'link';
  text: string;
  href?: string;
}

// Order matters: code spans first (their contents are literal), then links, bold, italics.
const INLINE = /`([^`]+)`|\[([^\]]+)\]\(([^)\s]+)\)|\*\*([^*]+)\*\*|\*([^*\s][^*]*)\*/g;

function safeHref(href: string): string | undefined {
  return /^(https?:\/\/|\/(?!\/)|#)/.test(href) ? href : undefined;
}

/**
 * Splits CommonMark-style inline markup (`code`, [links](url), **bold**, *italic*) into runs the
 * template renders as elements — never as HTML, so a description cannot inject markup. Links other
 * than http(s), same-site paths and fragments stay plain text.
 */
export function inlineMarkdown(source: string): TextRun[] {
  const runs: TextRun[] = [];
  let last = 0;
  const push = (run: TextRun) => {
    const previous = runs[runs.length - 1];
    if (run.kind === 'text' && previous?.kind === 'text') previous.text += run.text;
    else if (run.text) runs.push(run);
  };
  for (const match of source.matchAll(INLINE)) {
    const start = match.index ?? 0;
    push({ kind: 'text', text: source.slice(last, start) });
    const [whole, code, linkText, href, strong, em] = match;
    if (code !== undefined) push({ kind: 'code', text: code });
    else if (linkText !== undefined) {
      const safe = safeHref(href);
      push(safe ? { kind: 'link', text: linkText, href: safe } : { kind: 'text', text: linkText });
    } else if (strong !== undefined) push({ kind: 'strong', text: strong });
    else if (em !== undefined) push({ kind: 'em', text: em });
    else push({ kind: 'text', text: whole });
    last = start + whole.length;
  }
  push({ kind: 'text', text: source.slice(last) });
  return runs;
}
