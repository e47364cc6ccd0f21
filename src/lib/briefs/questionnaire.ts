// Questionnaires: the template shape in templates/questionnaires, answer validation, and exports. Pure.
import { z } from 'zod';

export const ANSWER_LIMITS = {
  short: 300,
  long: 5000,
  listItems: 20,
  listItem: 300,
} as const;

const questionSchema = z.strictObject({
  id: z.string().regex(/^[a-z][a-z0-9_]{0,39}$/),
  label: z.string().min(1).max(300),
  help: z.string().max(500).optional(),
  kind: z.enum(['short', 'long', 'list', 'choice']),
  options: z.array(z.string().min(1).max(120)).min(2).max(20).optional(),
  multiple: z.boolean().optional(),
  required: z.boolean().optional(),
});
export type Question = z.infer<typeof questionSchema>;

export const questionnaireSchema = z
  .strictObject({
    id: z.string().regex(/^[a-z][a-z0-9-]{0,59}$/),
    title: z.string().min(1).max(200),
    intro: z.string().max(2000),
    sections: z.array(z.strictObject({ title: z.string().min(1).max(200), questions: z.array(questionSchema).min(1).max(40) })).min(1).max(12),
  })
  .superRefine((q, ctx) => {
    const seen = new Set<string>();
    for (const s of q.sections)
      for (const question of s.questions) {
        if (seen.has(question.id)) ctx.addIssue({ code: 'custom', message: `question id "${question.id}" is used twice` });
        seen.add(question.id);
        if (question.kind === 'choice' && !question.options) ctx.addIssue({ code: 'custom', message: `choice question "${question.id}" needs options` });
      }
  });
export type Questionnaire = z.infer<typeof questionnaireSchema>;

export const allQuestions = (q: Questionnaire): Question[] => q.sections.flatMap((s) => s.questions);

/** The schema of one question's answer, with messages a client can act on. */
function answerSchema(question: Question): z.ZodType<string | string[]> {
  const label = `“${question.label}”`;
  switch (question.kind) {
    case 'short':
    case 'long': {
      const max = ANSWER_LIMITS[question.kind];
      return z.string({ error: `The answer to ${label} must be text.` }).max(max, { error: `The answer to ${label} is longer than ${max} characters.` });
    }
    case 'list':
      return z
        .array(z.string().max(ANSWER_LIMITS.listItem, { error: `Each line of ${label} may hold ${ANSWER_LIMITS.listItem} characters.` }), { error: `The answer to ${label} must be a list.` })
        .max(ANSWER_LIMITS.listItems, { error: `${label} takes at most ${ANSWER_LIMITS.listItems} lines.` });
    case 'choice': {
      const option = z.enum(question.options as [string, ...string[]], { error: `Choose one of the offered answers for ${label}.` });
      return question.multiple
        ? z.array(option, { error: `The answer to ${label} must be a list of choices.` }).max(question.options!.length)
        : z.union([option, z.literal('')], { error: `Choose one of the offered answers for ${label}.` });
    }
  }
}

/** Schema for a partial set of answers (autosave): only known question ids, each within its limits. */
export function answersSchema(q: Questionnaire) {
  const shape: Record<string, z.ZodType<string | string[]>> = {};
  for (const question of allQuestions(q)) shape[question.id] = answerSchema(question).optional() as z.ZodType<string | string[]>;
  return z.strictObject(shape);
}

const isBlank = (v: string | string[] | undefined) => v === undefined || (Array.isArray(v) ? v.every((x) => !x.trim()) : !v.trim());

/** Required questions still without an answer, by label. */
export function missingRequired(q: Questionnaire, answers: Record<string, string | string[]>): Question[] {
  return allQuestions(q).filter((question) => question.required && isBlank(answers[question.id]));
}

const show = (v: string | string[] | undefined) => (isBlank(v) ? '' : Array.isArray(v) ? v.filter((x) => x.trim()).join('; ') : v!.trim());

/** The answers as Markdown: a heading per section, each question in bold followed by its answer. */
export function answersMarkdown(meta: { brandName: string; title: string; contactName: string; submittedAt: string | null }, q: Questionnaire, answers: Record<string, string | string[]>): string {
  const out = [`# ${meta.title} — ${meta.brandName}`, '', `Answered by ${meta.contactName}${meta.submittedAt ? `, submitted ${meta.submittedAt.slice(0, 10)}` : ' (not submitted yet)'}.`, ''];
  for (const section of q.sections) {
    out.push(`## ${section.title}`, '');
    for (const question of section.questions) {
      const v = answers[question.id];
      out.push(`**${question.label}**`, '');
      if (Array.isArray(v) && !isBlank(v)) out.push(...v.filter((x) => x.trim()).map((x) => `- ${x.trim()}`));
      else out.push(show(v) || '_No answer._');
      out.push('');
    }
  }
  return out.join('\n');
}

/** RFC 4180 field quoting: quotes doubled, field quoted when it holds a comma, quote or line break. */
export function csvField(value: string): string {
  // Cells that a spreadsheet would run as a formula are prefixed with ' (common practice, OWASP "CSV injection").
  const safe = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/** The answers as CSV (RFC 4180, CRLF line ends): section, question, answer. */
export function answersCsv(q: Questionnaire, answers: Record<string, string | string[]>): string {
  const rows = [['section', 'question_id', 'question', 'answer']];
  for (const section of q.sections) for (const question of section.questions) rows.push([section.title, question.id, question.label, show(answers[question.id])]);
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
