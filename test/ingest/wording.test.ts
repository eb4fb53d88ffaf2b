/**
 * A bulletin folder's own wording (content/locales/<locale>.json): what check accepts, what it
 * refuses and where it points, and how the layer is scoped to the work of one issue.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { loadIssues } from '../../src/ingest/issues.ts';
import { loadMessages, toolMessages, withWording } from '../../src/text/index.ts';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';

type Config = typeof MINI_CONFIG & Record<string, unknown>;

/** The mini bulletin with its configuration changed and its own wording files (by locale, the file's text). */
function folderWith(change: (config: Config) => void, wording: Record<string, string> = {}): string {
  const config = structuredClone(MINI_CONFIG) as Config;
  change(config);
  const folder = writeMini({ 'bulletin.json': JSON.stringify(config, null, 2) });
  mkdirSync(join(folder, 'content', 'locales'), { recursive: true });
  for (const [locale, text] of Object.entries(wording)) writeFileSync(join(folder, 'content', 'locales', `${locale}.json`), text);
  return folder;
}

const ownBand = (config: Config) => {
  config.statusBands[0] = { key: 'below-usual', fromPercent: null };
};

async function problemsOf(folder: string): Promise<string[]> {
  const { problems } = await loadBulletin(folder);
  return problems.sorted().map((p) => `${p.severity} ${p.code} ${p.file}:${p.line} ${p.column} ${p.value}`.trimEnd());
}

describe("a bulletin folder's own wording", () => {
  it("a status band of the agency's own without words is an error at the band's line, in check as in build", async () => {
    const folder = folderWith(ownBand);
    // MINI_CONFIG pretty-printed: "statusBands" opens at line 20, its first band's key is on line 22.
    expect(await problemsOf(folder)).toEqual(['error config-band-words bulletin.json:22 statusBands below-usual']);
    const checked = await loadIssues(folder);
    expect(checked.errors).toBe(1);
    expect(checked.problems.map((problem) => problem.code)).toEqual(['config-band-words']);
  });

  it("the band's words in content/locales/<locale>.json pass check and reach the inputs, layered over the tool's", async () => {
    const folder = folderWith(ownBand, { en: JSON.stringify({ 'band.below-usual': 'below what is usual here' }, null, 2) });
    const { inputs, problems } = await loadBulletin(folder);
    expect(problems.items).toEqual([]);
    expect(inputs?.wording).toEqual({ en: { 'band.below-usual': 'below what is usual here' } });
    const layered = withWording(inputs?.wording, () => loadMessages('en'));
    expect(layered['band.below-usual' as keyof typeof layered]).toBe('below what is usual here');
    expect(layered['band.near']).toBe(toolMessages('en')['band.near']);
  });

  it("every configured language needs the band's words: missing in French is an error, and the English-only key a warning", async () => {
    const folder = folderWith(
      (config) => {
        ownBand(config);
        config.locales = ['en', 'fr'];
      },
      { en: JSON.stringify({ 'band.below-usual': 'below what is usual here' }, null, 2) },
    );
    expect(await problemsOf(folder)).toEqual([
      'error config-band-words bulletin.json:22 statusBands below-usual',
      'warning wording-one-language content/locales/en.json:2 band.below-usual fr',
    ]);
  });

  it('an unknown key is refused at its own line with the nearest known key', async () => {
    const text = `{\n  "band.near": "about as usual",\n\n  "key.regio": "x"\n}\n`;
    const { problems } = await loadBulletin(folderWith(() => {}, { en: text }));
    const [problem] = problems.errors;
    expect([problem?.code, problem?.file, problem?.line, problem?.column]).toEqual([
      'wording-invalid',
      'content/locales/en.json',
      4,
      'key.regio',
    ]);
    expect(problem?.expected).toBe('did you mean "key.region"?');
  });

  it('a placeholder the tool does not fill is refused; one left out is a warning, since a figure would vanish', async () => {
    const extra = await problemsOf(folderWith(() => {}, { en: JSON.stringify({ 'site.home': 'Home of {publisher}' }, null, 2) }));
    expect(extra).toEqual(['error wording-invalid content/locales/en.json:2 site.home {publisher}']);
    const dropped = await problemsOf(
      folderWith(() => {}, {
        en: JSON.stringify({ 'key.region': 'In {month}, our {waterBodies} held {percentOfBaseline}: {band}.' }, null, 2),
      }),
    );
    expect(dropped).toEqual(['warning wording-drops-placeholder content/locales/en.json:2 key.region {calendarMonth}']);
  });

  it('a message with forms by count reworded only in its base form is a warning naming the forms left', async () => {
    const problems = await problemsOf(
      folderWith(() => {}, {
        en: JSON.stringify(
          { 'key.deficit': 'Less water than usual for {months} months since {since}: {haMonths} hectare-months missing.' },
          null,
          2,
        ),
      }),
    );
    expect(problems).toEqual(['warning wording-plural-variants content/locales/en.json:2 key.deficit key.deficit.one']);
  });

  it('a value that is not one line of text, a file that is not JSON, and a language the issue does not publish', async () => {
    expect(await problemsOf(folderWith(() => {}, { en: JSON.stringify({ 'site.home': 'Home\n<b>page</b>' }, null, 2) }))).toEqual([
      'error wording-invalid content/locales/en.json:2 site.home Home\n<b>page</b>',
    ]);
    expect(await problemsOf(folderWith(() => {}, { en: JSON.stringify({ 'site.home': 7 }) }))).toEqual([
      'error wording-invalid content/locales/en.json:1 site.home 7',
    ]);
    const broken = await problemsOf(folderWith(() => {}, { en: '{\n  "site.home": "Home",\n  "page.overview" "Overview"\n}\n' }));
    expect(broken).toEqual(['error wording-invalid content/locales/en.json:3']);
    expect(await problemsOf(folderWith(() => {}, { fr: '{}' }))).toEqual(['warning wording-unused content/locales/fr.json:0  fr']);
  });

  it('the layer holds for the work withWording runs and what it awaits, never for other work at the same time', async () => {
    const ours = { en: { 'site.home': 'Our home' } };
    const seen: string[] = [];
    await Promise.all([
      withWording(ours, async () => {
        await new Promise((resolve) => setTimeout(resolve, 5));
        seen.push(`ours ${loadMessages('en')['site.home']}`);
      }),
      withWording({}, async () => {
        await new Promise((resolve) => setTimeout(resolve, 1));
        seen.push(`plain ${loadMessages('en')['site.home']}`);
      }),
    ]);
    expect(seen.sort()).toEqual(['ours Our home', `plain ${toolMessages('en')['site.home']}`]);
    expect(loadMessages('en')['site.home']).toBe(toolMessages('en')['site.home']);
  });
});
