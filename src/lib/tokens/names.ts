/** A token or file name in kebab-case: ASCII letters, digits and hyphens only (never '$', '{', '}' or '.'). */
export function kebabName(text: string, fallback = 'token'): string {
  const name = String(text ?? '')
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/([a-z0-9])([A-Z])/g, '$1-$2')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return name || fallback;
}

/** Returns a name not yet in `taken` (adding -2, -3 … as needed) and records it. */
export function uniqueName(name: string, taken: Set<string>): string {
  let candidate = name;
  for (let n = 2; taken.has(candidate); n++) candidate = `${name}-${n}`;
  taken.add(candidate);
  return candidate;
}
