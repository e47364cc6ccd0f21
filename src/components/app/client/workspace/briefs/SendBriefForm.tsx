// Send a questionnaire to the client's contact; checked with the route's own schema before it goes.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { sendBriefBody } from '@/lib/briefs/schemas';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { failed, mailed, type SetNote } from '../chrome';
import { useSendBrief, type BriefTemplate, type SendBrief } from './briefs.queries';

const limit = sendBriefBody.shape;

export function SendBriefForm({ brandId, templates, onNote }: { brandId: string; templates: BriefTemplate[]; onNote: SetNote }) {
  const { register, handleSubmit, reset, formState: { errors } } = useForm<SendBrief>({
    resolver: zodResolver(sendBriefBody, undefined, { raw: true }),
    defaultValues: { template: templates[0]?.id ?? '', contactName: '', contactEmail: '', message: '' },
  });
  const send = useSendBrief(brandId, {
    onSuccess: (r, sent) => {
      onNote(mailed(r, `The questionnaire is on its way to ${sent.contactEmail}.`));
      reset({ template: sent.template, contactName: '', contactEmail: '', message: '' });
    },
    onError: failed(onNote),
  });
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      send.mutate(values);
    },
    (invalid) => onNote({ kind: 'error', text: firstError(invalid) ?? 'Check the form.' }),
  );
  const invalid = (name: keyof SendBrief) => (errors[name] ? true : undefined);
  return (
    <form className="mt-4 grid gap-3 border-t border-rule pt-4 sm:grid-cols-2" aria-label="Send a brief" onSubmit={submit}>
      <div>
        <label className="label" htmlFor="brief-template">Questionnaire</label>
        <select id="brief-template" className="field" {...register('template')}>
          {templates.map((t) => <option key={t.id} value={t.id}>{t.title} ({t.questions} questions)</option>)}
        </select>
      </div>
      <div>
        <label className="label" htmlFor="brief-name">Contact name</label>
        <input id="brief-name" className="field" maxLength={maxLengthOf(limit.contactName)} aria-invalid={invalid('contactName')} {...register('contactName')} />
      </div>
      <div>
        <label className="label" htmlFor="brief-email">Contact e-mail</label>
        <input id="brief-email" type="email" className="field" maxLength={maxLengthOf(limit.contactEmail)} aria-invalid={invalid('contactEmail')} {...register('contactEmail')} />
      </div>
      <div>
        <label className="label" htmlFor="brief-message">A line from you (optional)</label>
        <input id="brief-message" className="field" maxLength={maxLengthOf(limit.message)} aria-invalid={invalid('message')} {...register('message')} />
      </div>
      <div><button className="btn-primary" disabled={send.isPending}>{send.isPending ? 'Sending…' : 'Send the questionnaire'}</button></div>
    </form>
  );
}
