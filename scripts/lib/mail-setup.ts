// E-mail for a started server: a real relay when SMTP_HOST is set, otherwise the local catcher, whose messages the
// sent-mail page shows. Shared by `npm start` and `npm run start:scaled`.
import { join } from 'node:path';
import { startFakeSmtp } from '@/lib/mail/fake-smtp';
import { dataDir } from './settings';

export interface MailSettings {
  smtpHost: string;
  smtpPort: number;
  captureDir?: string;
}

export async function startMail(): Promise<MailSettings> {
  if (process.env.SMTP_HOST) return { smtpHost: process.env.SMTP_HOST, smtpPort: Number(process.env.SMTP_PORT ?? 587) };
  // Each caught message is named here with its first link: nobody's inbox receives it, so whoever runs this
  // server hands an address link to the person who signed up (the viewer only opens once an address is proven).
  const fake = await startFakeSmtp({
    dir: join(dataDir, 'mail'),
    port: Number(process.env.PLUMBLINE_SMTP_PORT ?? 0),
    onMessage: (m) => {
      const link = /https?:\/\/\S+/.exec(m.text)?.[0];
      console.log(`  ✉ to ${m.envelope.to.join(', ')}: ${m.subject}${link ? `\n    ${link}` : ''}`);
    },
  });
  return { smtpHost: fake.host, smtpPort: fake.port, captureDir: fake.dir };
}
