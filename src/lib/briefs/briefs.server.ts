// Briefs: a questionnaire sent to a client contact, answered through a tokened link without an account.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { Brand } from '@db/models';
import { Brief, type BriefAnswers } from '@db/models/collaboration';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError, parseWith } from '@/lib/http/api';
import { hashToken, longDate, newToken } from '@/lib/invitations/tokens';
import { peopleById } from '@/lib/invitations/people.server';
import { sendTemplate, siteLink, type MailOutcome } from '@/lib/mail/mail.server';
import { allQuestions, answersSchema, missingRequired, questionnaireSchema, type Questionnaire } from './questionnaire';
import type { BriefStatus, BriefView, PublicBrief } from './views';

export type { BriefStatus, BriefView, PublicBrief } from './views';

export const BRIEF_DAYS = 30;

/** The questionnaire templates shipped in templates/questionnaires, checked against the schema. */
export function questionnaireTemplates(): Questionnaire[] {
  const dir = join(process.cwd(), 'templates', 'questionnaires');
  return readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => questionnaireSchema.parse(JSON.parse(readFileSync(join(dir, f), 'utf8'))));
}

const countAnswered = (b: Brief) => allQuestions(b.questions).filter((q) => {
  const v = b.answers[q.id];
  return Array.isArray(v) ? v.some((x) => x.trim()) : !!v?.trim();
}).length;

export function statusOf(b: Brief): BriefStatus {
  if (b.submittedAt) return 'submitted';
  if (b.revokedAt) return 'withdrawn';
  if (b.expiresAt.getTime() <= Date.now()) return 'expired';
  return b.answeredAt ? 'in_progress' : 'sent';
}

function view(b: Brief, sentBy?: string | null): BriefView {
  return {
    id: b.id,
    title: b.title,
    template: b.template,
    contactName: b.contactName,
    contactEmail: b.contactEmail,
    status: statusOf(b),
    sentAt: b.createdAt.toISOString(),
    sentBy: sentBy ?? null,
    expiresAt: b.expiresAt.toISOString(),
    answeredAt: b.answeredAt?.toISOString() ?? null,
    submittedAt: b.submittedAt?.toISOString() ?? null,
    answered: countAnswered(b),
    questions: allQuestions(b.questions).length,
  };
}

/** Send a brief: store the questions as they are now, e-mail the contact a link. */
export async function sendBrief(
  caller: Caller,
  brand: Brand,
  body: { template: string; contactName: string; contactEmail: string; message?: string },
): Promise<{ brief: BriefView; mail: MailOutcome }> {
  const questionnaire = questionnaireTemplates().find((q) => q.id === body.template);
  if (!questionnaire) throw new ApiError(400, 'unknown_template', `There is no questionnaire called "${body.template}".`, { path: 'template' });
  const { token, hash } = newToken();
  const brief = await sequelize.transaction(async (t) => {
    const row = await Brief.create(
      {
        brandId: brand.id,
        template: questionnaire.id,
        title: questionnaire.title,
        questions: questionnaire,
        contactName: body.contactName,
        contactEmail: body.contactEmail,
        tokenHash: hash,
        sentById: caller.id,
        expiresAt: new Date(Date.now() + BRIEF_DAYS * 86_400_000),
        answeredAt: null,
        submittedAt: null,
        revokedAt: null,
      },
      { transaction: t },
    );
    await audit({ actorId: caller.id, action: 'brief.send', targetType: 'brief', targetId: row.id, brandId: brand.id, studioId: brand.studioId, details: { template: questionnaire.id, contactEmail: body.contactEmail } }, t);
    return row;
  });
  const mail = await sendTemplate(
    body.contactEmail,
    'brief-request',
    {
      contactName: body.contactName,
      senderName: caller.name || caller.email,
      studioName: caller.name || 'Your designer',
      brandName: brand.name,
      briefTitle: questionnaire.title,
      message: body.message ?? '',
      expiresOn: longDate(brief.expiresAt),
      link: siteLink(`/brief/${token}`),
    },
    brand.id,
  );
  return { brief: view(brief, caller.name), mail };
}

/** The brand's briefs, newest first. */
export async function listBriefs(brand: Brand): Promise<BriefView[]> {
  const rows = await Brief.findAll({ where: { brandId: brand.id }, order: [['createdAt', 'DESC']] });
  const people = await peopleById(rows.map((r) => r.sentById));
  return rows.map((r) => view(r, people.get(r.sentById ?? '')?.name));
}

export async function briefOf(brand: Brand, briefId: string): Promise<Brief> {
  const b = await Brief.findOne({ where: { id: briefId, brandId: brand.id } });
  if (!b) throw new ApiError(404, 'not_found', 'That brief was not found on this brand.');
  return b;
}

/** One brief with its questions and answers, for the designer. */
export async function briefDetail(brand: Brand, briefId: string) {
  const b = await briefOf(brand, briefId);
  const people = await peopleById([b.sentById]);
  return { brief: view(b, people.get(b.sentById ?? '')?.name), questionnaire: b.questions, answers: b.answers };
}

/** Withdraw a brief: its link stops working; answers already given are kept. */
export async function withdrawBrief(caller: Caller, brand: Brand, briefId: string): Promise<BriefView> {
  const b = await briefOf(brand, briefId);
  if (b.submittedAt) throw new ApiError(409, 'already_submitted', 'This brief has been submitted; it is kept with the brand and cannot be withdrawn.');
  await sequelize.transaction(async (t) => {
    await b.update({ revokedAt: b.revokedAt ?? new Date() }, { transaction: t });
    await audit({ actorId: caller.id, action: 'brief.withdraw', targetType: 'brief', targetId: b.id, brandId: brand.id, studioId: brand.studioId }, t);
  });
  return view(b);
}

// ---------------------------------------------------------------- the client's side, by token

const LINK_PROBLEMS: Record<'expired' | 'withdrawn', { status: number; code: string; message: string }> = {
  expired: { status: 410, code: 'brief_expired', message: `This questionnaire link has expired (links work for ${BRIEF_DAYS} days). Ask your designer for a new one; nothing you saved is lost.` },
  withdrawn: { status: 410, code: 'brief_withdrawn', message: 'Your designer has withdrawn this questionnaire. Ask them if a new one is on its way.' },
};

/** The brief a token opens, or a 404 that does not say whether such a brief exists. */
async function briefByToken(token: string): Promise<Brief & { brand: Brand }> {
  const b = await Brief.findOne({ where: { tokenHash: hashToken(token) } });
  if (!b) throw new ApiError(404, 'not_found', 'This questionnaire link is not valid. Check that the whole link was copied from the e-mail.');
  const brand = (await Brand.findByPk(b.brandId))!;
  return Object.assign(b, { brand });
}

function refuseClosed(b: Brief) {
  const s = statusOf(b);
  if (s === 'expired' || s === 'withdrawn') {
    const p = LINK_PROBLEMS[s];
    throw new ApiError(p.status, p.code, p.message);
  }
}

/** What the client sees at /brief/<token>. A closed link raises its own clear error. */
export async function openBrief(token: string): Promise<PublicBrief> {
  const b = await briefByToken(token);
  if (!b.submittedAt) refuseClosed(b);
  return {
    brandName: b.brand.name,
    title: b.title,
    contactName: b.contactName,
    status: statusOf(b),
    expiresAt: b.expiresAt.toISOString(),
    submittedAt: b.submittedAt?.toISOString() ?? null,
    savedAt: b.answeredAt?.toISOString() ?? null,
    questionnaire: b.questions,
    answers: b.answers,
  };
}

/** Merge some answers into the saved ones (autosave); one UPDATE, so two tabs cannot erase each other's fields. */
export async function saveAnswers(token: string, patch: unknown): Promise<{ savedAt: string; answered: number }> {
  const b = await briefByToken(token);
  refuseClosed(b);
  if (b.submittedAt) throw new ApiError(409, 'already_submitted', 'These answers were already sent to your designer, so they can no longer be changed.');
  const answers = parseWith(answersSchema(b.questions), patch, 'answers') as BriefAnswers;
  return sequelize.transaction(async (t) => {
    const rows = await sequelize.query<{ answers: BriefAnswers; answered_at: Date }>(
      `UPDATE briefs SET answers = answers || :patch::jsonb, answered_at = now(), updated_at = now()
        WHERE id = :id AND submitted_at IS NULL AND revoked_at IS NULL RETURNING answers, answered_at`,
      { replacements: { patch: JSON.stringify(answers), id: b.id }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!rows.length) throw new ApiError(409, 'already_submitted', 'These answers were already sent to your designer, so they can no longer be changed.');
    await audit({ actorId: null, action: 'brief.answer', targetType: 'brief', targetId: b.id, brandId: b.brandId, studioId: b.brand.studioId, details: { by: b.contactEmail, questions: Object.keys(answers) } }, t);
    b.answers = rows[0].answers;
    return { savedAt: new Date(rows[0].answered_at).toISOString(), answered: countAnswered(b) };
  });
}

/** Send the answers to the designer: every required question must be answered; afterwards they are read-only. */
export async function submitBrief(token: string): Promise<{ submittedAt: string }> {
  const b = await briefByToken(token);
  refuseClosed(b);
  if (b.submittedAt) throw new ApiError(409, 'already_submitted', 'These answers were already sent to your designer.');
  const missing = missingRequired(b.questions, b.answers);
  if (missing.length) {
    throw new ApiError(400, 'answers_missing', `A few questions still need an answer: ${missing.map((q) => `“${q.label}”`).join(', ')}.`, missing.map((q) => ({ path: q.id, message: 'This question needs an answer.' })));
  }
  const submittedAt = new Date();
  await sequelize.transaction(async (t) => {
    const [count] = await Brief.update({ submittedAt }, { where: { id: b.id, submittedAt: null }, transaction: t });
    if (!count) throw new ApiError(409, 'already_submitted', 'These answers were already sent to your designer.');
    await audit({ actorId: null, action: 'brief.submit', targetType: 'brief', targetId: b.id, brandId: b.brandId, studioId: b.brand.studioId, details: { by: b.contactEmail } }, t);
  });
  const sender = (await peopleById([b.sentById])).get(b.sentById ?? '');
  if (sender) {
    await sendTemplate(sender.email, 'brief-submitted', { contactName: b.contactName, briefTitle: b.title, brandName: b.brand.name, link: siteLink(`/app/brands/${b.brandId}/client#brief-${b.id}`) }, b.brandId);
  }
  return { submittedAt: submittedAt.toISOString() };
}
