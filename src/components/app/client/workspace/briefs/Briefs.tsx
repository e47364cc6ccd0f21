// Briefs: the questionnaires sent to the client, their state and answers, and the form to send one.
import { useState } from 'react';
import type { BriefView } from '@/lib/briefs/views';
import { date, ListState, Notice, Panel, type ClientCaps, type Note } from '../chrome';
import { BriefAnswers } from './BriefAnswers';
import { useBriefs } from './briefs.queries';
import { SendBriefForm } from './SendBriefForm';

const BRIEF_STATUS: Record<BriefView['status'], string> = { sent: 'Sent, not opened yet', in_progress: 'Being answered', submitted: 'Answered', expired: 'Link expired', withdrawn: 'Withdrawn' };

export function Briefs({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const [note, setNote] = useState<Note>(null);
  const [openId, setOpenId] = useState<string | null>(null);
  const q = useBriefs(brandId);
  return (
    <Panel id="briefs" title="Brief" intro="A questionnaire your client answers through a link, without an account. Answers are kept with the brand.">
      <Notice note={note} />
      {q.isPending || q.isError ? <ListState query={q} /> : (
        <>
          {q.data.briefs.length === 0 && <p className="mt-4 text-ink-soft">No brief yet. {caps.edit ? 'Send one to the client’s contact below to start onboarding.' : 'The designer has not sent one yet.'}</p>}
          <ul className="mt-4 divide-y divide-rule">
            {q.data.briefs.map((b) => (
              <li key={b.id} id={`brief-${b.id}`} className="py-3">
                <div className="flex flex-wrap items-center gap-3">
                  <div>
                    <p className="font-semibold">{b.title} <span className="font-normal text-ink-soft">· {b.contactName} &lt;{b.contactEmail}&gt;</span></p>
                    <p className="text-sm text-ink-soft">{BRIEF_STATUS[b.status]} · {b.answered} of {b.questions} answered · sent {date(b.sentAt)}{b.submittedAt ? ` · submitted ${date(b.submittedAt)}` : ''}</p>
                  </div>
                  <div className="ml-auto flex gap-2">
                    <button type="button" className="btn-quiet px-3 py-1.5" aria-expanded={openId === b.id} onClick={() => setOpenId(openId === b.id ? null : b.id)}>{openId === b.id ? 'Hide answers' : 'Read answers'}</button>
                    <a className="btn-quiet px-3 py-1.5" href={`/api/brands/${brandId}/briefs/${b.id}/export?format=md`}>Markdown</a>
                    <a className="btn-quiet px-3 py-1.5" href={`/api/brands/${brandId}/briefs/${b.id}/export?format=csv`}>CSV</a>
                  </div>
                </div>
                {openId === b.id && <BriefAnswers brandId={brandId} briefId={b.id} />}
              </li>
            ))}
          </ul>
          {caps.edit && <SendBriefForm brandId={brandId} templates={q.data.templates} onNote={setNote} />}
        </>
      )}
    </Panel>
  );
}
