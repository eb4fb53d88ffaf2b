/**
 * The agency's accent colour (site.accentColour): refused below WCAG 2.2 AA contrast (4.5:1,
 * success criterion 1.4.3) against what it is read on, and those colours are the stylesheet's own.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { ACCENT_BACKGROUNDS } from '../../src/ingest/config.ts';
import { contrastRatio } from '../../src/common/colourVision.ts';
import { TOOL_ACCENT } from '../../src/render/index.ts';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';

const withAccent = (colour: string) =>
  writeMini({ 'bulletin.json': JSON.stringify({ ...MINI_CONFIG, site: { ...MINI_CONFIG.site, accentColour: colour } }, null, 2) });

describe('site.accentColour', () => {
  it('a dark enough colour is taken; a light one is refused at its line, with the ratios it reaches', async () => {
    const dark = await loadBulletin(withAccent('#7A1F5C'));
    expect(dark.problems.items).toEqual([]);
    expect(dark.inputs?.config.site.accentColour).toBe('#7A1F5C');
    const light = await loadBulletin(withAccent('#66ccff'));
    expect(light.inputs).toBeNull();
    const [problem] = light.problems.errors;
    // MINI_CONFIG pretty-printed: "site" opens at line 34, accentColour is its second key (line 36).
    expect([problem?.code, problem?.line, problem?.column, problem?.value]).toEqual([
      'config-accent-contrast',
      36,
      'site.accentColour',
      '#66ccff',
    ]);
    expect(problem?.message).toMatch(/below WCAG 2\.2 AA \(4\.5:1\)/);
  });

  it("the check reads the accent against the stylesheet's own page and header colours, which the tool's accent passes", () => {
    const css = readFileSync(new URL('../../templates/assets/site.css', import.meta.url), 'utf8');
    const root = /:root \{([^}]*)\}/.exec(css)?.[1] ?? '';
    const variable = (name: string) => new RegExp(`--${name}: (#[0-9a-f]{6});`).exec(root)?.[1];
    expect(variable('paper')).toBe(ACCENT_BACKGROUNDS.page);
    expect(variable('tint')).toBe(ACCENT_BACKGROUNDS.header);
    expect(variable('accent-ink')).toBe(ACCENT_BACKGROUNDS.page);
    expect(root).toContain(TOOL_ACCENT);
    const tool = variable('accent') as string;
    for (const background of Object.values(ACCENT_BACKGROUNDS)) expect(contrastRatio(tool, background)).toBeGreaterThanOrEqual(4.5);
  });
});
