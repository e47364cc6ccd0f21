// The print edition's page rules: paper size, margins, running heads and folios, one named page per section.
// Every brand value that reaches this CSS goes through cssString(), so nothing typed by an editor can end a
// string, a rule or the <style> element.

export type PaperSize = 'a4' | 'letter';

/** A CSS string literal holding `value` as text: quotes, backslashes, angle brackets and control characters escaped. */
export function cssString(value: string): string {
  let out = '"';
  for (const ch of value) {
    const code = ch.codePointAt(0)!;
    // Letters, digits, spaces and plain punctuation pass; everything else becomes a hex escape (CSS Syntax 3, 4.3.7).
    if (/[\p{L}\p{N} .,:;!?()[\]{}@#%*+=_|~^$\-–—‘’“”·…/&']/u.test(ch) && code > 0x1f) out += ch;
    else out += `\\${code.toString(16)} `;
  }
  return `${out}"`;
}

export interface PrintSection {
  /** The CSS page name of the section (letters, digits and hyphens only). */
  pageName: string;
  title: string;
}

export interface PrintPageRules {
  size: PaperSize;
  brandName: string;
  /** "Version 3 · 2 December 2026", in the footer of every body page. */
  edition: string;
  sections: PrintSection[];
}

const SIZE = { a4: 'A4', letter: 'letter' } as const;

/** The @page rules of the print edition: the front matter bare, every body page with running heads and a folio. */
export function printPageRules({ size, brandName, edition, sections }: PrintPageRules): string {
  const box = 'font-family: var(--print-head-font); font-size: 7.5pt; letter-spacing: 0.06em; color: #5c5c5c;';
  const rules = [
    `@page { size: ${SIZE[size]}; margin: 22mm 18mm 20mm 20mm;`,
    `  @top-left { content: ${cssString(brandName)}; ${box} vertical-align: bottom; padding-bottom: 5mm; }`,
    `  @bottom-left { content: ${cssString(edition)}; ${box} vertical-align: top; padding-top: 6mm; }`,
    `  @bottom-right { content: counter(page); ${box} font-size: 8.5pt; vertical-align: top; padding-top: 6mm; } }`,
    '@page front { margin: 20mm; @top-left { content: none; } @bottom-left { content: none; } @bottom-right { content: none; } }',
  ];
  for (const { pageName, title } of sections) {
    if (!/^[a-z][a-z0-9-]*$/.test(pageName)) continue;
    rules.push(`@page ${pageName} { @top-right { content: ${cssString(title)}; ${box} vertical-align: bottom; padding-bottom: 5mm; } }`);
    rules.push(`.print-edition [data-print-page="${pageName}"] { page: ${pageName}; }`);
  }
  return rules.join('\n');
}
