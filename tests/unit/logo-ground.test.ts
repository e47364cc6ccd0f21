// The thinnest-stroke estimate, checked on drawings of our own with known geometry.
import { describe, expect, test } from 'vitest';
import { thinnestStroke } from '@/lib/logo/stroke.server';

describe('thinnestStroke (common practice: the finest line decides the minimum size)', () => {
  test.each([
    ['a 2-unit ring on a filled disc of another colour', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="40" fill="#000"/><circle cx="50" cy="50" r="40" fill="none" stroke="#f00" stroke-width="2"/></svg>', 2],
    ['a 4-unit bar on a transparent canvas', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><rect x="10" y="48" width="80" height="4" fill="#123"/></svg>', 4],
  ])('%s measures about its drawn width', async (_label, svg, width) => {
    const measured = await thinnestStroke(Buffer.from(svg), { x: 0, y: 0, width: 100, height: 100 }, true);
    expect(Math.abs(measured - width)).toBeLessThanOrEqual(0.6);
  });
});
