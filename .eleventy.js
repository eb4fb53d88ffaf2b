// Eleventy wiring only: folders, filters, passthrough copies. All logic lives in src/ (TypeScript);
// the build hands the finished bulletin model in as global data.
import { fileURLToPath } from 'node:url';

const templates = fileURLToPath(new URL('./templates/', import.meta.url));

export default function (eleventyConfig) {
  eleventyConfig.addPassthroughCopy({ [`${templates}assets`]: 'assets' });
  eleventyConfig.setQuietMode(true);
  // The templates are the tool's own: installed with npm they sit below a node_modules folder, which
  // Eleventy skips by default, and the .gitignore of whatever folder the user runs in is not theirs to apply.
  eleventyConfig.ignores.delete('**/node_modules/**');
  eleventyConfig.setUseGitIgnore(false);
}

export const config = {
  dir: { includes: '_includes' },
  templateFormats: ['njk'],
  htmlTemplateEngine: 'njk',
};
