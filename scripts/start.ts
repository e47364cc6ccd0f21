// `npm start`: PostgreSQL (installed if missing), migrations, demo, build, serve, and the sign-ins printed.
import { join } from 'node:path';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../db/seeders/demo';
import { publishDemo } from './lib/demo-publish';
import { buildApp, prepareDatabase, startServer } from './lib/prepare';
import { startCluster } from './lib/postgres';
import { startFakeSmtp } from '../src/lib/mail/fake-smtp';
import { authSecret, dataDir, host, pgPort, port, siteUrl } from './lib/settings';

const started = Date.now();
const step = (what: string) => console.log(`\n▸ ${what}`);

step(`PostgreSQL on 127.0.0.1:${pgPort} (data in ${join(dataDir, 'postgres')})`);
const databaseUrl = process.env.DATABASE_URL ?? startCluster(join(dataDir, 'postgres'), pgPort).url;
const secret = authSecret();
const signInLimit = Number(process.env.AUTH_SIGN_IN_LIMIT ?? 5);

step('Migrations and demo data');
const filesDir = join(dataDir, 'files');
const { migrations } = await prepareDatabase({ databaseUrl, siteUrl, secret, signInLimit }, { filesDir });
console.log(migrations.length ? `  applied ${migrations.length} migration(s)` : '  schema up to date');

if (process.env.PLUMBLINE_SKIP_BUILD !== '1') {
  step('Building the app');
  buildApp();
}

// E-mail: a real relay when SMTP_HOST is set, otherwise the local fake, whose messages the sent-mail page shows.
let mail: { smtpHost: string; smtpPort: number; captureDir?: string };
if (process.env.SMTP_HOST) {
  mail = { smtpHost: process.env.SMTP_HOST, smtpPort: Number(process.env.SMTP_PORT ?? 587) };
} else {
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
  mail = { smtpHost: fake.host, smtpPort: fake.port, captureDir: fake.dir };
  step(`Local mail catcher on ${fake.host}:${fake.port} (messages in ${fake.dir}; read them at ${siteUrl}/app/mail)`);
}

step('Starting the server');
const server = await startServer({ host, port, databaseUrl, siteUrl, secret, signInLimit, filesDir, mail });
let shareUrl: string | null = null;
try {
  shareUrl = await publishDemo(siteUrl, dataDir);
  // The demo review anchors its comments to the published draft's blocks: seed again now that they exist.
  await prepareDatabase({ databaseUrl, siteUrl, secret, signInLimit }, { filesDir });
} catch (err) {
  console.warn(`  (the demo version could not be published: ${(err as Error).message})`);
}
const width = Math.max(...DEMO_PEOPLE.map((p) => p.email.length));
console.log(`
Plumbline is running at ${siteUrl}   (ready in ${((Date.now() - started) / 1000).toFixed(1)} s)

Demo sign-ins (password for all: ${DEMO_PASSWORD})
${DEMO_PEOPLE.map((p) => `  ${p.email.padEnd(width)}  ${p.says}`).join('\n')}

${shareUrl ? `Demo share link (no account needed): ${shareUrl}\n\n` : ''}Ctrl-C stops the server; \`npm run db:stop\` stops PostgreSQL.
`);

const stop = () => server.kill('SIGTERM');
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
server.on('exit', (code) => process.exit(code ?? 0));
