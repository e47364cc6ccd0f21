// Logos on dark grounds and the thinnest-stroke estimate, checked on drawings of our own with known geometry.
import { describe, expect, test } from 'vitest';
import sharp from 'sharp';
import { reverseOnGround } from '../../src/lib/logo';
import { thinnestStroke } from '../../src/lib/logo/stroke.server';

// A dark disc with a light square on it (a badge mark), 100 × 100 units.
const BADGE = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="45" fill="#3a2418"/><rect x="35" y="35" width="30" height="30" fill="#efe4cf"/></svg>';

describe('reverseOnGround', () => {
  test('dark paint turns white and light paint takes the ground colour, so the inner detail stays visible', async () => {
    const svg = reverseOnGround(BADGE, '#1b1714');
    expect(svg).toMatch(/<circle[^>]*fill="#ffffff"/);
    expect(svg).toMatch(/<rect[^>]*fill="#1b1714"/);
    // Drawn, the centre is the ground colour and the ring around it white (read back with sharp).
    const { data, info } = await sharp(Buffer.from(svg), { density: 72 }).flatten({ background: '#1b1714' }).raw().toBuffer({ resolveWithObject: true });
    const px = (x: number, y: number) => Array.from(data.subarray((y * info.width + x) * 3, (y * info.width + x) * 3 + 3));
    expect(px(50, 50)).toEqual([0x1b, 0x17, 0x14]);
    expect(px(50, 20)).toEqual([255, 255, 255]);
  });

  test('a bad ground colour is a clear error', () => {
    expect(() => reverseOnGround(BADGE, 'night')).toThrow(/ground colour/);
  });
});

describe('thinnestStroke (common practice: the finest line decides the minimum size)', () => {
  test.each([
    ['a 2-unit ring on a filled disc of another colour', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="40" fill="#000"/><circle cx="50" cy="50" r="40" fill="none" stroke="#f00" stroke-width="2"/></svg>', 2],
    ['a 4-unit bar on a transparent canvas', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><rect x="10" y="48" width="80" height="4" fill="#123"/></svg>', 4],
  ])('%s measures about its drawn width', async (_label, svg, width) => {
    const measured = await thinnestStroke(Buffer.from(svg), { x: 0, y: 0, width: 100, height: 100 }, true);
    expect(Math.abs(measured - width)).toBeLessThanOrEqual(0.6);
  });
});
