/**
 * The agency's logo (site.logo): a PNG, or an SVG that only draws; anything else is refused with
 * the configuration's line, and the file stays inside the bulletin folder.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';

const DRAWING =
  '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><defs><linearGradient id="g"/></defs><circle cx="5" cy="5" r="4" fill="url(#g)"/><use href="#g"/></svg>';
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0]);

async function withLogo(path: string, bytes?: string | Buffer) {
  const folder = writeMini({
    'bulletin.json': JSON.stringify({ ...MINI_CONFIG, site: { ...MINI_CONFIG.site, logo: { path, alt: 'Test office' } } }, null, 2),
  });
  if (bytes !== undefined) {
    mkdirSync(join(folder, 'content'), { recursive: true });
    writeFileSync(join(folder, path), bytes);
  }
  return loadBulletin(folder);
}

describe('site.logo', () => {
  it('a PNG and an SVG that only draws are taken, bytes as they are, with their alt text', async () => {
    const png = await withLogo('content/logo.png', PNG);
    expect(png.problems.items).toEqual([]);
    expect(png.inputs?.logo?.type).toBe('png');
    expect(png.inputs?.logo?.bytes.equals(PNG)).toBe(true);
    const svg = await withLogo('content/logo.svg', DRAWING);
    expect(svg.problems.items).toEqual([]);
    expect(svg.inputs?.logo).toMatchObject({ type: 'svg', alt: 'Test office' });
  });

  it('an SVG that could do more than draw is refused, naming what it holds', async () => {
    const cases: Array<[string, RegExp]> = [
      ['<svg><script>alert(1)</script></svg>', /a script element/],
      ['<svg onload="alert(1)"></svg>', /an event handler/],
      ['<svg><a href="javascript:alert(1)"><text>x</text></a></svg>', /javascript: address|a link to another file/],
      ['<svg><foreignObject><div>x</div></foreignObject></svg>', /embedded HTML/],
      ['<svg><image href="/etc/passwd"/></svg>', /a link to another file/],
      ['<svg><rect style="fill: url(https://example.org/x)"/></svg>', /a url\(\) to another file/],
    ];
    for (const [text, reason] of cases) {
      const { inputs, problems } = await withLogo('content/logo.svg', text);
      expect(inputs, text).toBeNull();
      const [problem] = problems.errors;
      expect(problem?.code, text).toBe('logo-invalid');
      expect(problem?.message, text).toMatch(reason);
      // MINI_CONFIG pretty-printed: site at line 34, logo at 36, its path at 37.
      expect(problem?.line, text).toBe(37);
    }
  });

  it('a file that is neither, a missing file and a path outside the folder are refused', async () => {
    expect((await withLogo('content/logo.gif', 'GIF89a')).problems.errors[0]?.message).toBe('the logo is neither a PNG nor an SVG');
    expect((await withLogo('content/none.png')).problems.errors[0]?.code).toBe('logo-invalid');
    const outside = await withLogo('../logo.png');
    expect(outside.inputs).toBeNull();
    expect(outside.problems.errors[0]?.message).toMatch(/outside|folder/);
  });
});
