// This process's one listening connection for change notices (PostgreSQL LISTEN): it reconnects with back-off,
// listens again, then drops every notice-kept memory once, since notices may have been missed meanwhile. A round
// trip every 250 ms proves the connection current; memories answer only while it is (see NoticeBoard).
import pg from 'pg';
import { DATABASE_URL } from 'astro:env/server';
import { log } from '@/lib/log.server';
import { CHANGE_CHANNEL, NoticeBoard, readNotice, reconnectDelay } from './notice';
import { processIdentity } from './process.server';

const ROUND_TRIP_EVERY_MS = 250;

/** The notice-kept memories of this process. */
export const noticeBoard = new NoticeBoard();

let started = false;
let listening = false;

/** Whether the notice connection is up and current (for the health answer). */
export const noticesCurrent = (): boolean => listening && noticeBoard.current;

/** Start listening (once per process); memories stay silent until the first LISTEN succeeded. */
export function startChangeNotices(): void {
  if (started) return;
  started = true;
  void listenForever();
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms).unref());

async function listenForever(): Promise<void> {
  let listenedBefore = false;
  for (let attempt = 0; ; attempt++) {
    const client = new pg.Client({ connectionString: DATABASE_URL, keepAlive: true, connectionTimeoutMillis: 5000, query_timeout: 2000, application_name: 'plumbline-notices' });
    const closed = new Promise<Error | undefined>((resolve) => {
      client.on('error', resolve);
      client.on('end', () => resolve(undefined));
    });
    try {
      await client.connect();
      client.on('notification', (message) => {
        if (message.channel !== CHANGE_CHANNEL) return;
        const notice = readNotice(message.payload);
        if (notice) noticeBoard.hear(notice);
        else log.warn({ channel: message.channel }, 'a change notice that is not ours was ignored');
      });
      const sentAt = Date.now();
      await client.query(`LISTEN ${CHANGE_CHANNEL}`);
      noticeBoard.resume(sentAt);
      listening = true;
      if (listenedBefore) log.info({ attempts: attempt + 1 }, 'change notices reconnected; notice-kept memory dropped');
      else log.info({ process: processIdentity.id }, 'change notices listening');
      listenedBefore = true;
      attempt = -1;
      const why = await Promise.race([closed, roundTrips(client)]);
      log.warn({ err: why }, 'change notices connection lost; reconnecting');
    } catch (err) {
      log.warn({ err, attempt }, 'change notices could not connect; retrying');
    }
    listening = false;
    noticeBoard.lost();
    client.end().catch(() => undefined);
    await sleep(reconnectDelay(Math.max(attempt, 0)));
  }
}

/** Confirms the connection current four times a second; resolves with the error once a round trip fails. */
async function roundTrips(client: pg.Client): Promise<Error> {
  for (;;) {
    await sleep(ROUND_TRIP_EVERY_MS);
    const sentAt = Date.now();
    try {
      await client.query('SELECT 1');
      noticeBoard.confirm(sentAt);
    } catch (err) {
      return err as Error;
    }
  }
}
