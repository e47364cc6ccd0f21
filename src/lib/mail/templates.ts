// E-mail templates from templates/email: `<name>.txt` (first line "Subject: …") and `<name>.html`, in one layout.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

export type TemplateValue = string | number | boolean | null | undefined | string[];
export type TemplateData = Record<string, TemplateValue>;

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

/**
 * A small logic-less renderer: {{name}} (escaped in HTML), {{{name}}} (as is), {{#name}}…{{/name}} repeated for
 * each item of a list when it holds {{.}} (the item), otherwise shown once when non-empty, {{^name}}…{{/name}} shown when empty or false.
 */
export function renderTemplate(source: string, data: TemplateData, mode: 'html' | 'text'): string {
  const esc = mode === 'html' ? escapeHtml : (s: string) => s;
  const sections = source.replace(/\{\{([#^])(\w+)\}\}([\s\S]*?)\{\{\/\2\}\}/g, (_m, kind: string, key: string, inner: string) => {
    const value = data[key];
    const empty = value == null || value === false || value === '' || (Array.isArray(value) && value.length === 0);
    if (kind === '^') return empty ? renderTemplate(inner, data, mode) : '';
    if (empty) return '';
    if (Array.isArray(value) && inner.includes('{{.}}')) return value.map((item) => renderTemplate(inner.replace(/\{\{\.\}\}/g, esc(item)), data, mode)).join('');
    return renderTemplate(inner, data, mode);
  });
  return sections
    .replace(/\{\{\{(\w+)\}\}\}/g, (_m, key: string) => String(data[key] ?? ''))
    .replace(/\{\{(\w+)\}\}/g, (_m, key: string) => esc(String(data[key] ?? '')));
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
  const html = renderTemplate(read('layout.html'), { ...data, subject }, 'html').replace('<!--body-->', body);
  return { subject, text, html };
}
