// E-mail templates from templates/email: `<name>.txt` (first line "Subject: …") and `<name>.html`, in one layout.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Mustache from 'mustache';
import { escapeHtml } from '@/lib/safe/escape';

export type TemplateValue = string | number | boolean | null | undefined | string[];
export type TemplateData = Record<string, TemplateValue>;

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

/** Text mode writes values as they are; HTML mode uses the one HTML escaper (OWASP XSS Prevention, rule 1). */
const ESCAPE = { html: escapeHtml, text: (value: unknown) => String(value ?? '') } as const;

/**
 * Our templates' one extension of mustache: a section over a list that never prints {{.}} shows once, not once per
 * item ("{{#summary}}What changed{{/summary}}"). It rewrites our own template text only, never a value.
 */
function onceForLists(source: string, data: TemplateData): string {
  return source.replace(/\{\{#(\w+)\}\}([\s\S]*?)\{\{\/\1\}\}/g, (whole, key: string, inner: string) =>
    Array.isArray(data[key]) && !inner.includes('{{.}}') ? `{{#${key}.length}}${inner}{{/${key}.length}}` : whole,
  );
}

/**
 * Renders a template with mustache (logic-less; a value is inserted once and never read as a template again):
 * {{name}} escaped in HTML, {{{name}}} raw (only for HTML we built and escaped ourselves), {{#name}}…{{/name}} sections
 * repeated per list item with {{.}}, {{^name}}…{{/name}} when empty or false.
 */
export function renderTemplate(source: string, data: TemplateData, mode: 'html' | 'text'): string {
  return Mustache.render(onceForLists(source, data), data, {}, { escape: ESCAPE[mode] });
}

const templateDir = () => join(process.cwd(), 'templates', 'email');
const read = (file: string) => readFileSync(join(templateDir(), file), 'utf8');

/** The message for template `name`: subject from the text file's first line, the HTML body inside the layout. */
export function renderMail(name: string, data: TemplateData): RenderedMail {
  if (!/^[a-z-]+$/.test(name)) throw new Error(`not a template name: ${name}`);
  const [first, ...rest] = read(`${name}.txt`).split('\n');
  if (!first.startsWith('Subject: ')) throw new Error(`templates/email/${name}.txt must start with "Subject: "`);
  const subject = renderTemplate(first.slice('Subject: '.length), data, 'text').trim();
  const text = renderTemplate(rest.join('\n'), data, 'text').replace(/\n{3,}/g, '\n\n').trim() + '\n';
  const body = renderTemplate(read(`${name}.html`), data, 'html');
  // A function replacer: a "$&" or "$'" in the body is text, not a replacement pattern.
  const html = renderTemplate(read('layout.html'), { ...data, subject }, 'html').replace('<!--body-->', () => body);
  return { subject, text, html };
}
