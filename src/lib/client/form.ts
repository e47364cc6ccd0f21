// Limits read from the API's own zod schemas, so a form shows the limit the server enforces (written once).
import type { FieldErrors, FieldValues } from 'react-hook-form';
import type { z } from 'zod';

/** The schema inside optional(), nullable() and default(). */
function inner(schema: z.ZodType): z.ZodType {
  let s = schema as z.ZodType & { unwrap?: () => z.ZodType };
  while (s.def.type === 'optional' || s.def.type === 'nullable' || s.def.type === 'default') s = s.unwrap!() as typeof s;
  return s;
}

/** The longest text a string schema accepts, for an input's maxLength. */
export const maxLengthOf = (schema: z.ZodType): number | undefined => (inner(schema) as { maxLength?: number | null }).maxLength ?? undefined;

/** The smallest and largest number a number schema accepts, for an input's min and max. */
export function rangeOf(schema: z.ZodType): { min?: number; max?: number } {
  const s = inner(schema) as { minValue?: number | null; maxValue?: number | null };
  return { min: s.minValue ?? undefined, max: s.maxValue ?? undefined };
}

/** The first message among a form's errors (depth-first, in field order), e.g. for one notice above the form. */
export function firstError<T extends FieldValues>(errors: FieldErrors<T>): string | undefined {
  for (const value of Object.values(errors)) {
    if (!value || typeof value !== 'object') continue;
    if (typeof (value as { message?: unknown }).message === 'string') return (value as { message: string }).message;
    const nested = firstError(value as FieldErrors<T>);
    if (nested) return nested;
  }
  return undefined;
}
