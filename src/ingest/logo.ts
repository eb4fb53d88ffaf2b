/**
 * The agency's logo (site.logo): a PNG, or an SVG that can do nothing but be drawn. It is shown as
 * an <img>, where an SVG's scripts never run, but it is also published as a file anyone can open
 * on its own; so an SVG with a script, an event handler, a javascript: address, embedded HTML or a
 * reference to anything but itself or an embedded image is refused, never cleaned.
 */
import { say, type ProblemText } from '../common/problemMessages.ts';
import { readFileSync } from 'node:fs';
import { lineOfPath, type BulletinConfig } from './config.ts';
import { ConfinementError, resolveInside } from './confine.ts';
import type { ProblemList } from './problems.ts';

export interface Logo {
  /** The file's bytes, published as they are. */
  bytes: Buffer;
  type: 'png' | 'svg';
  alt: string;
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** What an SVG logo may not hold, each with the words a problem gives it. */
const SVG_REFUSED: Array<[RegExp, string]> = [
  [/<\s*script\b/i, 'a script element'],
  [/\son[a-z]+\s*=/i, 'an event handler attribute (on…=)'],
  [/javascript\s*:/i, 'a javascript: address'],
  [/<\s*foreignObject\b/i, 'embedded HTML (foreignObject)'],
  [/<!ENTITY/i, 'an entity declaration'],
  [/\shref\s*=\s*["'](?!#|data:image\/(png|jpeg|gif|webp);)/i, 'a link to another file or address (only #id and embedded images are kept)'],
  [/url\(\s*["']?(?!#)/i, 'a url() to another file or address'],
  [/@import/i, 'a style sheet import'],
];

export function readLogo(root: string, config: BulletinConfig, problems: ProblemList, configLabel: string, configText = ''): Logo | null {
  const logo = config.site.logo;
  if (!logo) return null;
  const fail = (value: string, expected: string, message: ProblemText) => {
    problems.error({
      code: 'logo-invalid',
      file: configLabel,
      line: lineOfPath(configText, ['site', 'logo', 'path']),
      column: 'site.logo.path',
      value,
      expected,
      message,
    });
    return null;
  };
  let bytes: Buffer;
  try {
    bytes = readFileSync(resolveInside(root, logo.path, 'logo'));
  } catch (error) {
    if (error instanceof ConfinementError) return fail(logo.path, error.expected, error.message);
    throw error;
  }
  if (bytes.subarray(0, 8).equals(PNG_SIGNATURE)) return { bytes, type: 'png', alt: logo.alt };
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return fail(logo.path, 'a PNG or an SVG (UTF-8 text)', say('logo-not-image'));
  }
  if (!/<svg[\s>]/.test(text.slice(0, 4096))) return fail(logo.path, 'a PNG or an SVG (UTF-8 text)', say('logo-not-image'));
  for (const [pattern, what] of SVG_REFUSED) {
    const found = pattern.exec(text);
    if (found)
      return fail(
        found[0].trim().slice(0, 60),
        'an SVG that only draws: no scripts, event handlers, embedded HTML or links to other files',
        say('logo-svg-active', { what, line: text.slice(0, found.index).split('\n').length }),
      );
  }
  return { bytes, type: 'svg', alt: logo.alt };
}
