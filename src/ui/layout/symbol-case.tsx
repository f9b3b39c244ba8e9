import type { ReactNode } from 'react';

/*
 * Titles are set in capitals by the style sheet; the symbols and units inside them are not, because
 * their case is their meaning (u₂ is not U₂, t₀ not T₀, µs not ΜS). This wraps each symbol of a
 * title in a span the style sheet leaves as written (`.symbol`).
 */

/**
 * A symbol: a letter with a sub- or superscript (u₂, t₀, f₀, Δ₀) with what it is applied to
 * ("u₂(T)"), a word starting with a Greek letter, or a unit with a prefix or lower-case letters
 * (mK, µs, Hz, W/cm²: 1651 mK is not 1651 MK).
 */
const SYMBOL =
  /[A-Za-zΔδλκσμµ][\u2080-\u2089\u00b2\u00b3\u2070-\u2079]+(?:\([^)]*\))?|[ΔδλκσμµΩ]\S*|(?<![\w/])(?:[mµnk]?(?:K|s|m|Hz|Pa|W|V|bar)(?:\/(?:cm²|s|K))?|m\/s)(?![\w/])/g;

/** `text` with its symbols kept in their case inside a capitalised title. */
export function symbolCase(text: string): ReactNode {
  const parts: ReactNode[] = [];
  let last = 0;
  for (const m of text.matchAll(SYMBOL)) {
    const at = m.index ?? 0;
    if (at > last) parts.push(text.slice(last, at));
    parts.push(
      <span key={at} className="symbol">
        {m[0]}
      </span>,
    );
    last = at + m[0].length;
  }
  if (parts.length === 0) return text;
  if (last < text.length) parts.push(text.slice(last));
  return parts;
}
