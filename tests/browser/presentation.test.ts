// The reveal presentation in Debian's chromium, opened through a share link that includes it: keys, buttons and
// swipes move one slide at a time, the change is announced, reduced motion is honoured, and axe-core (Deque; its
// rules for WCAG 2.0–2.2 levels A and AA) finds no serious or critical violation on any slide.
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEMO_BRANDS, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, signIn } from '../support/client';
import { launchOptions, publishedDemoBrand, seriousViolations } from '../support/browser';

let browser: Browser;
let context: BrowserContext;
let page: Page;
let total: number;
const errors: string[] = [];
const slug = DEMO_BRANDS[0].slug;

const counter = () => page.locator('[data-deck-count]').textContent();
const announced = () => page.locator('[data-deck-live]').textContent();
/** Until the slide's fade-in has ended (axe-core would read its colours half faded). */
const still = (p: Page) => p.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'));
/** The slide regions a reader can see (the others are hidden). */
const visibleSlides = () => page.locator('section[aria-roledescription="slide"]:visible');

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  const owner = await signIn(DEMO_PEOPLE[0].email);
  const brandId = await publishedDemoBrand(owner);
  const link = await owner.post(`/api/brands/${brandId}/share-links`, { label: 'Reveal walk', allowPresentation: true });
  expect(link.status).toBe(201);
  context = await browser.newContext({ viewport: { width: 1280, height: 720 }, reducedMotion: 'no-preference' });
  page = await context.newPage();
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(link.body.shareLink.url);
  await page.waitForURL(new RegExp(`/b/${slug}$`));
  await page.goto(`${baseUrl()}/b/${slug}/presentation`);
  await page.locator('html[data-deck-mode="on"]').waitFor();
  total = await page.locator('section[data-slide]').count();
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

describe('the presentation in a browser', () => {
  test('opens on the first slide, one slide at a time, with a visible counter', async () => {
    expect(total).toBeGreaterThanOrEqual(6);
    expect(await counter()).toBe(`1 / ${total}`);
    expect(await page.locator('[data-deck-count]').isVisible()).toBe(true);
    expect(await visibleSlides().count()).toBe(1);
    expect(await visibleSlides().first().getAttribute('data-slide')).toBe('opening');
  });

  test('moves with the arrow keys, Page Up/Down, Space and Home/End, and announces each change', async () => {
    await page.keyboard.press('ArrowRight');
    expect(await counter()).toBe(`2 / ${total}`);
    expect(await announced()).toMatch(new RegExp(`^Slide 2 of ${total}: `));
    expect(await visibleSlides().count()).toBe(1);
    await page.keyboard.press('PageDown');
    expect(await counter()).toBe(`3 / ${total}`);
    await page.keyboard.press('Space');
    expect(await counter()).toBe(`4 / ${total}`);
    await page.keyboard.press('Shift+Space');
    expect(await counter()).toBe(`3 / ${total}`);
    await page.keyboard.press('PageUp');
    expect(await counter()).toBe(`2 / ${total}`);
    await page.keyboard.press('ArrowLeft');
    expect(await counter()).toBe(`1 / ${total}`);
    await page.keyboard.press('ArrowLeft'); // already at the first: stays
    expect(await counter()).toBe(`1 / ${total}`);
    await page.keyboard.press('End');
    expect(await counter()).toBe(`${total} / ${total}`);
    expect(await visibleSlides().first().getAttribute('data-slide')).toBe('closing');
    expect(await page.getByRole('button', { name: 'Next slide' }).isDisabled()).toBe(true);
    await page.keyboard.press('Home');
    expect(await counter()).toBe(`1 / ${total}`);
    expect(await page.getByRole('button', { name: 'Previous slide' }).isDisabled()).toBe(true);
    expect(page.url()).toMatch(/#slide-1$/);
  });

  test('the buttons move too, and Space on a focused button presses only that button', async () => {
    await page.getByRole('button', { name: 'Next slide' }).focus();
    await page.keyboard.press('Space');
    expect(await counter()).toBe(`2 / ${total}`);
    await page.getByRole('button', { name: 'Previous slide' }).click();
    expect(await counter()).toBe(`1 / ${total}`);
  });

  test('a swipe to the left turns to the next slide, to the right back', async () => {
    const swipe = (from: number, to: number) =>
      page.evaluate(
        ([a, b]) => {
          const deck = document.querySelector('[data-deck]')!;
          const at = (type: string, x: number) => deck.dispatchEvent(new PointerEvent(type, { pointerType: 'touch', clientX: x, clientY: 360, bubbles: true, isPrimary: true }));
          at('pointerdown', a);
          at('pointerup', b);
        },
        [from, to],
      );
    await swipe(900, 300);
    expect(await counter()).toBe(`2 / ${total}`);
    await swipe(300, 900);
    expect(await counter()).toBe(`1 / ${total}`);
    await swipe(600, 620); // a tap, not a swipe
    expect(await counter()).toBe(`1 / ${total}`);
  });

  test('a real touch swipe (Chromium touch events through the DevTools protocol) turns the slide', async () => {
    const touch = await browser.newContext({ viewport: { width: 1280, height: 720 }, hasTouch: true, isMobile: false, storageState: await context.storageState() });
    const phone = await touch.newPage();
    await phone.goto(`${baseUrl()}/b/${slug}/presentation`);
    await phone.locator('html[data-deck-mode="on"]').waitFor();
    const cdp = await touch.newCDPSession(phone);
    const drag = async (from: number, to: number) => {
      await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: [{ x: from, y: 360 }] });
      for (let step = 1; step <= 5; step++) await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: [{ x: from + ((to - from) * step) / 5, y: 360 }] });
      await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
    };
    const at = () => phone.locator('[data-deck-count]').textContent();
    await drag(1000, 300);
    await expect.poll(at).toBe(`2 / ${total}`);
    await drag(300, 1000);
    await expect.poll(at).toBe(`1 / ${total}`);
    await touch.close();
  });

  test('reloading keeps the slide', async () => {
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    await page.reload();
    await page.locator('html[data-deck-mode="on"]').waitFor();
    expect(await counter()).toBe(`3 / ${total}`);
    await page.keyboard.press('Home');
  });

  test('axe-core finds no serious or critical violation on any slide', async () => {
    for (let n = 1; n <= total; n++) {
      await still(page);
      const serious = await seriousViolations(page);
      expect(serious, `slide ${n}`).toEqual([]);
      await page.keyboard.press('ArrowRight');
    }
    await page.keyboard.press('Home');
  }, 300_000);

  test('slides fade in, except for a reader who asked for reduced motion (Media Queries 5, prefers-reduced-motion)', async () => {
    const animation = (p: Page) => p.evaluate(() => getComputedStyle(document.querySelector('section[data-current]')!).animationName);
    expect(await animation(page)).toBe('slide-in');
    const still = await browser.newContext({ viewport: { width: 1280, height: 720 }, reducedMotion: 'reduce', storageState: await context.storageState() });
    const quiet = await still.newPage();
    await quiet.goto(`${baseUrl()}/b/${slug}/presentation`);
    await quiet.locator('html[data-deck-mode="on"]').waitFor();
    expect(await animation(quiet)).toBe('none');
    await still.close();
  });

  test('a share link without the presentation opens the guidelines but not the slides: a readable page says why', async () => {
    const owner = await signIn(DEMO_PEOPLE[0].email);
    const brandId = await publishedDemoBrand(owner);
    const link = await owner.post(`/api/brands/${brandId}/share-links`, { label: 'Guidelines only' });
    expect(link.status).toBe(201);
    const guest = await browser.newContext({ viewport: { width: 1280, height: 720 } });
    const visitor = await guest.newPage();
    await visitor.goto(link.body.shareLink.url);
    await visitor.waitForURL(new RegExp(`/b/${slug}$`));
    const refused = await visitor.goto(`${baseUrl()}/b/${slug}/presentation`);
    expect(refused?.status()).toBe(403);
    await visitor.getByRole('heading', { name: 'The presentation is not part of this link' }).waitFor();
    expect(await visitor.getByText('Ask the brand team for a link that includes the presentation.').isVisible()).toBe(true);
    expect(await visitor.locator('section[data-slide]').count()).toBe(0);
    expect(await seriousViolations(visitor)).toEqual([]);
    await guest.close();
  });

  test('the photographs and the one-colour finding are slides of the deck when the version has them', async () => {
    const shown = await page.locator('section[data-slide]').evaluateAll((all) => all.map((s) => s.getAttribute('data-slide')));
    // The demo's logos lean on colour (the ember ring on the roast disc), found by the tone check.
    expect(shown).toContain('without-colour');
    expect(shown.indexOf('without-colour')).toBe(shown.indexOf('one-colour') + 1);
    for (const img of await page.locator('section[data-slide="photographs"] img').all()) {
      expect((await img.getAttribute('alt'))?.trim()).toBeTruthy();
      expect(await img.getAttribute('srcset')).toMatch(/aspect=/);
    }
  });

  test('no script error on the way', () => {
    expect(errors).toEqual([]);
  });
});
