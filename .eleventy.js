// Eleventy wiring only: folders, filters, passthrough copies. All logic lives in src/ (TypeScript);
// the build hands the finished bulletin model in as global data.
import { fileURLToPath } from 'node:url';

const templates = fileURLToPath(new URL('./templates/', import.meta.url));

export default function (eleventyConfig) {
  eleventyConfig.addPassthroughCopy({ [`${templates}assets`]: 'assets' });
  eleventyConfig.setQuietMode(true);
}

export const config = {
  dir: { includes: '_includes' },
  templateFormats: ['njk'],
  htmlTemplateEngine: 'njk',
};
