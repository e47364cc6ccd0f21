// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import mdx from '@astrojs/mdx';
import tailwindcss from '@tailwindcss/vite';

// Hosts whose Host header Astro may trust when it builds request URLs (and so checks origins):
// loopback for local use and tests, plus the configured site's host when one is given at build time.
const siteHost = process.env.SITE_URL ? new URL(process.env.SITE_URL) : null;
const allowedDomains = [
  { hostname: '127.0.0.1' },
  { hostname: 'localhost' },
  ...(siteHost ? [{ hostname: siteHost.hostname, protocol: siteHost.protocol.replace(':', '') }] : []),
];

export default defineConfig({
  output: 'server',
  // A second build (tests, a parallel checkout) can go elsewhere without touching dist/.
  outDir: process.env.PLUMBLINE_OUT_DIR ?? './dist',
  // Middleware mode: scripts/serve.mjs is the server, so it can hand each request its socket's own address.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), mdx()],
  security: { checkOrigin: true, allowedDomains },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    plugins: [tailwindcss()],
    ssr: { external: ['@aws-sdk/client-s3', '@aws-sdk/lib-storage', 'sharp', 'fontkit', 'pg', 'pg-hstore', 'sequelize', 'isomorphic-dompurify', 'nodemailer'] },
  },
  env: {
    // Every setting is read at run time, so one build serves any port, database or site URL.
    schema: {
      DATABASE_URL: envField.string({ context: 'server', access: 'secret' }),
      SITE_URL: envField.string({ context: 'server', access: 'secret', default: 'http://127.0.0.1:4321' }),
      AUTH_SECRET: envField.string({ context: 'server', access: 'secret' }),
      FILES_DIR: envField.string({ context: 'server', access: 'secret', default: '.data/files' }),
      // Where stored files live (src/lib/storage): `local` disk under FILES_DIR, or `s3`, an S3-compatible object
      // store shared by every process. Without S3_ENDPOINT, the provider's own address for S3_REGION.
      STORAGE: envField.enum({ context: 'server', access: 'secret', values: ['local', 's3'], default: 'local' }),
      S3_ENDPOINT: envField.string({ context: 'server', access: 'secret', optional: true }),
      S3_BUCKET: envField.string({ context: 'server', access: 'secret', default: 'plumbline-files' }),
      S3_REGION: envField.string({ context: 'server', access: 'secret', default: 'us-east-1' }),
      S3_ACCESS_KEY_ID: envField.string({ context: 'server', access: 'secret', optional: true }),
      S3_SECRET_ACCESS_KEY: envField.string({ context: 'server', access: 'secret', optional: true }),
      S3_FORCE_PATH_STYLE: envField.boolean({ context: 'server', access: 'secret', default: true }),
      CHROMIUM_PATH: envField.string({ context: 'server', access: 'secret', default: '/usr/bin/chromium' }),
      AUTH_SIGN_IN_LIMIT: envField.number({ context: 'server', access: 'secret', default: 5 }),
      // Proxies whose X-Forwarded-For is believed (comma-separated IPs or CIDRs); empty: only the socket counts.
      TRUSTED_PROXIES: envField.string({ context: 'server', access: 'secret', default: '' }),
      // Renditions (src/lib/assets): custom renditions kept per asset beyond the standard set, and new (uncached)
      // custom renditions one caller may have drawn per minute. The pixel caps are constants in kinds.ts.
      RENDITION_CUSTOM_LIMIT: envField.number({ context: 'server', access: 'secret', default: 40 }),
      RENDITION_RATE_LIMIT: envField.number({ context: 'server', access: 'secret', default: 30 }),
      // Mock-ups (src/lib/mockups): new (uncached) drawings one member may ask the draft route for per minute.
      MOCKUP_RATE_LIMIT: envField.number({ context: 'server', access: 'secret', default: 20 }),
      // E-mail (src/lib/mail): an SMTP relay; without SMTP_HOST nothing is sent. MAIL_CAPTURE_DIR is set only
      // when the local fake server keeps the messages, and turns on the sent-mail page.
      SMTP_HOST: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_PORT: envField.number({ context: 'server', access: 'secret', default: 587 }),
      SMTP_USER: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_PASSWORD: envField.string({ context: 'server', access: 'secret', optional: true }),
      MAIL_FROM: envField.string({ context: 'server', access: 'secret', default: 'Plumbline <mail@plumbline.invalid>' }),
      MAIL_CAPTURE_DIR: envField.string({ context: 'server', access: 'secret', optional: true }),
      // Handover payments through the provider's official SDK (src/lib/handover/payments.server.ts). Unset key: the
      // handover screen says payments are not set up. STRIPE_API_BASE (e.g. http://127.0.0.1:4400) points the SDK at the
      // local fake that `npm start` and the tests run; leave it unset with real keys and the same code talks to the service.
      STRIPE_SECRET_KEY: envField.string({ context: 'server', access: 'secret', optional: true }),
      STRIPE_WEBHOOK_SECRET: envField.string({ context: 'server', access: 'secret', optional: true }),
      STRIPE_API_BASE: envField.string({ context: 'server', access: 'secret', optional: true }),
      // E-mails one account may send per hour: invitations, resends, briefs, mood boards, review requests.
      MAIL_SEND_LIMIT: envField.number({ context: 'server', access: 'secret', default: 60 }),
      // The logger's level (src/lib/log.server.ts): JSON lines on stdout at this level and above.
      // Whether this process works the job queue (builds, PDFs, notices). Off in a web process when a worker of its
      // own runs beside it; on by default, so one `npm start` process does everything.
      QUEUE_WORKER: envField.boolean({ context: 'server', access: 'secret', default: true }),
      // What this process is for, as GET /api/health reports it: `web` answers people (the default, also for the
      // single `npm start` process), `worker` is the process of `npm run start:scaled` that works the queue.
      PROCESS_ROLE: envField.enum({ context: 'server', access: 'secret', values: ['web', 'worker'], default: 'web' }),
      // Megabytes of built files (and their brotli/gzip forms) each web process keeps in memory for published reads.
      SITE_MEMORY_MB: envField.number({ context: 'server', access: 'secret', default: 128 }),
      LOG_LEVEL: envField.enum({ context: 'server', access: 'secret', values: ['trace', 'debug', 'info', 'warn', 'error', 'fatal', 'silent'], default: 'info' }),
    },
  },
});
